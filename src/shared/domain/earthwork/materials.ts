/**
 * Material factors: EDITABLE DEFAULTS, not authority. Agencies, specifications and soils differ; replace them
 * with the project's test values. Swell from a textbook table (see the domain reference, section 3); angle of
 * repose from engineering handbooks (dry sand 25-35 deg, 34 typical; moist sand 30-45; wet sand 45; smooth gravel
 * 30; sharp gravel 40; dry lump clay 25-40; wet excavated clay 15). Shrinkage is left to the project (null)
 * where no published value was seen.
 */
export interface MaterialFactors {
  id: string;
  name: string;
  swellPercent: number;
  shrinkagePercent: number | null;
  angleOfReposeDeg: number | null;
}

export const MATERIAL_TABLE_LABEL = 'Editable defaults: agencies and soils differ; use the project\'s own test values where you have them.';

export const DEFAULT_MATERIALS: readonly MaterialFactors[] = Object.freeze([
  { id: 'clay', name: 'Clay', swellPercent: 40, shrinkagePercent: null, angleOfReposeDeg: 25 },
  { id: 'common-earth', name: 'Common earth or loam', swellPercent: 25, shrinkagePercent: null, angleOfReposeDeg: null },
  { id: 'sand', name: 'Sand (dry)', swellPercent: 12, shrinkagePercent: null, angleOfReposeDeg: 34 },
  { id: 'gravel', name: 'Gravel (smooth)', swellPercent: 12, shrinkagePercent: null, angleOfReposeDeg: 30 },
  { id: 'hardpan', name: 'Hardpan', swellPercent: 50, shrinkagePercent: null, angleOfReposeDeg: null },
  { id: 'blasted-rock', name: 'Rock, well blasted', swellPercent: 65, shrinkagePercent: null, angleOfReposeDeg: null },
  { id: 'shale', name: 'Shale', swellPercent: 65, shrinkagePercent: null, angleOfReposeDeg: null },
  { id: 'sandstone', name: 'Sandstone', swellPercent: 54, shrinkagePercent: null, angleOfReposeDeg: null },
  { id: 'limestone', name: 'Limestone', swellPercent: 67, shrinkagePercent: null, angleOfReposeDeg: null },
]);

/**
 * The project's table: the defaults with its own edits applied (by id), plus any materials it added. The
 * defaults themselves are never changed.
 */
export function materialTable(edits: readonly (Partial<MaterialFactors> & { id: string })[] = []): MaterialFactors[] {
  const table = DEFAULT_MATERIALS.map((m) => ({ ...m }));
  for (const edit of edits) {
    const existing = table.find((m) => m.id === edit.id);
    if (existing) Object.assign(existing, edit);
    else table.push({ name: edit.id, swellPercent: 0, shrinkagePercent: null, angleOfReposeDeg: null, ...edit });
  }
  return table;
}
