/**
 * LandXML 1.2 units (schema LandXML-1.2.xsd, element Units: Metric or Imperial). `elevationUnit` has the schema
 * default "meter" in both, so an Imperial file that does not write it carries its elevations in metres.
 */
export const LANDXML_LENGTH_UNITS = [
  'millimeter',
  'centimeter',
  'meter',
  'kilometer',
  'foot',
  'USSurveyFoot',
  'inch',
  'mile',
] as const;
export type LandXmlLengthUnit = (typeof LANDXML_LENGTH_UNITS)[number];

/**
 * Metres in one unit. International foot 0.3048 m exactly; US survey foot 1200/3937 m exactly (NIST, "U.S.
 * survey foot", and the Federal Register notice 85 FR 62698 that deprecated it on 2022-12-31); inch 0.0254 m;
 * international mile 1609.344 m.
 */
export const METRES_PER_UNIT: Readonly<Record<LandXmlLengthUnit, number>> = {
  millimeter: 0.001,
  centimeter: 0.01,
  meter: 1,
  kilometer: 1000,
  foot: 0.3048,
  USSurveyFoot: 1200 / 3937,
  inch: 0.0254,
  mile: 1609.344,
};

export interface LandXmlUnits {
  /** The Units child written in the file, or null when the file has no Units (then the caller must ask). */
  system: 'Metric' | 'Imperial' | null;
  /** Plan coordinates (northing, easting), station and offset. */
  linearUnit: LandXmlLengthUnit;
  /** Elevations. */
  elevationUnit: LandXmlLengthUnit;
  /** True when elevationUnit was not written and the schema's default (meter) applies. */
  elevationUnitDefaulted: boolean;
}

export function isLengthUnit(value: string): value is LandXmlLengthUnit {
  return (LANDXML_LENGTH_UNITS as readonly string[]).includes(value);
}

/**
 * Factor that turns a value in `from` into the worksheet's unit (ft = international foot, m). Same unit: exactly
 * 1. US survey feet to feet: (1200/3937) / 0.3048 = 1.000002000004..., the 2 ppm that matters on State Plane
 * coordinates.
 */
export function factorTo(from: LandXmlLengthUnit, to: 'ft' | 'm'): number {
  if ((to === 'ft' && from === 'foot') || (to === 'm' && from === 'meter')) return 1;
  if (to === 'ft' && from === 'USSurveyFoot') return 1200 / 3937 / 0.3048;
  return METRES_PER_UNIT[from] / (to === 'ft' ? 0.3048 : 1);
}
