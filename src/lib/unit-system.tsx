import { createContext, useCallback, useContext, useMemo, useState, type ReactNode } from 'react';
import { formatQuantity, type QuantityKind, type UnitSystem, unitOf } from './units';

interface UnitSystemState {
  system: UnitSystem;
  setSystem(system: UnitSystem): void;
  format(kind: QuantityKind, si: number | null | undefined, options?: { unit?: boolean; digits?: number; exact?: boolean }): string;
  label(kind: QuantityKind): string;
}

const UnitSystemContext = createContext<UnitSystemState | null>(null);
const STORAGE_KEY = 'isobath.units';

export function UnitSystemProvider({ children }: { children: ReactNode }) {
  const [system, setState] = useState<UnitSystem>(() => (localStorage.getItem(STORAGE_KEY) === 'US' ? 'US' : 'SI'));
  const setSystem = useCallback((next: UnitSystem) => {
    localStorage.setItem(STORAGE_KEY, next);
    setState(next);
  }, []);
  const value = useMemo<UnitSystemState>(
    () => ({
      system,
      setSystem,
      format: (kind, si, options) => formatQuantity(kind, system, si, options),
      label: (kind) => unitOf(kind, system).label,
    }),
    [system, setSystem],
  );
  return <UnitSystemContext.Provider value={value}>{children}</UnitSystemContext.Provider>;
}

export function useUnits(): UnitSystemState {
  const ctx = useContext(UnitSystemContext);
  if (!ctx) throw new Error('useUnits must be used inside UnitSystemProvider');
  return ctx;
}
