import { createContext, useContext } from 'react';

/** A locked original ground surface of the project, offered to the surface worksheet as its existing survey. */
export type WorksheetBaseline = {
  id: string;
  label: string;
  sha256: string;
  downloadUrl: string;
  /** A point file's column order, as recorded (the worksheet reads the file in it); null for LandXML. */
  pointOrder: 'PNEZD' | 'PENZD' | null;
};

/** Provided by the worksheets route (the surface baselines feature reads them); empty where there are none. */
export const WorksheetBaselinesContext = createContext<readonly WorksheetBaseline[]>([]);

export function useWorksheetBaselines(): readonly WorksheetBaseline[] {
  return useContext(WorksheetBaselinesContext);
}
