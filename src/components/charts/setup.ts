import {
  Chart as ChartJS,
  CategoryScale,
  LinearScale,
  LogarithmicScale,
  PointElement,
  LineElement,
  BarElement,
  Tooltip,
  Legend,
  Filler,
} from 'chart.js';
import { colors, fontFamily } from '@shared/design-tokens';

ChartJS.register(CategoryScale, LinearScale, LogarithmicScale, PointElement, LineElement, BarElement, Tooltip, Legend, Filler);
ChartJS.defaults.font.family = fontFamily.sans.join(', ');
ChartJS.defaults.color = colors.ink.soft;
ChartJS.defaults.animation = false;

export const palette = colors;
