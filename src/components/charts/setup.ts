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
import tokens from '../../../tailwind.config';

ChartJS.register(CategoryScale, LinearScale, LogarithmicScale, PointElement, LineElement, BarElement, Tooltip, Legend, Filler);
ChartJS.defaults.font.family = 'Lato, system-ui, sans-serif';
ChartJS.defaults.color = '#3b5360';
ChartJS.defaults.animation = false;

export const palette = tokens.theme.extend.colors;
