import { createContext, useContext, type ReactNode } from 'react';
import { METRIC_PREFERENCES, type UnitPreferences } from '@shared/calc/units.calc';

const UnitsContext = createContext<UnitPreferences>(METRIC_PREFERENCES);

/** The signed-in user's units, for every value shown or typed below it. */
export function UnitsProvider({ units, children }: { units: UnitPreferences; children: ReactNode }) {
  return <UnitsContext.Provider value={units}>{children}</UnitsContext.Provider>;
}

/** The units the user reads and types in; metric when nobody said otherwise. */
export function useUnits(): UnitPreferences {
  return useContext(UnitsContext);
}
