import { useEffect, useState } from 'react';
import { TextField } from '@/components/ui/field';
import { useUnits } from '@/lib/unit-system';
import { fromDisplay, toDisplay } from '@/lib/units';

/**
 * A temperature typed in the chosen unit system, committed in °C on blur or Enter.
 * The text follows the committed value only when that value or the unit system changes.
 */
export function TemperatureInput({
  label,
  celsius,
  onCommit,
  extraError,
}: {
  label: string;
  celsius: number | undefined;
  onCommit: (celsius: number | undefined) => void;
  extraError?: string;
}) {
  const { system, label: unitLabel } = useUnits();
  const [text, setText] = useState('');
  useEffect(() => {
    setText(celsius === undefined ? '' : String(Math.round(toDisplay('temperature', system, celsius) * 10) / 10));
  }, [celsius, system]);
  const value = Number(text);
  const invalid = text.trim() !== '' && !Number.isFinite(value);
  const commit = () => {
    if (invalid) return;
    onCommit(text.trim() === '' ? undefined : Math.round(fromDisplay('temperature', system, value) * 100) / 100);
  };
  return (
    <TextField
      label={label}
      unit={unitLabel('temperature')}
      inputMode="decimal"
      value={text}
      onChange={(e) => setText(e.target.value)}
      onBlur={commit}
      onKeyDown={(e) => {
        if (e.key === 'Enter') commit();
      }}
      error={invalid ? 'Enter a number' : extraError}
    />
  );
}
