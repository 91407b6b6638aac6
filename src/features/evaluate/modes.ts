import type { FailureMode } from '@shared/engine';
import tokens from '../../../tailwind.config';

export const MODE_LABELS: Record<FailureMode, string> = {
  tension: 'Tension',
  compression: 'Compression',
  shear: 'Shear',
  buckling: 'Buckling',
};

/** One colour per failure mode, used in the table, both charts and the design record. */
export const MODE_COLOURS: Record<FailureMode, string> = tokens.theme.extend.colors.mode;
