export { boundariesIn, breaklinesIn, sectionsIn, surfacePointsIn, unitFactors } from './convert';
export { packXyz } from './pack';
export { POINT_ORDERS, orderFromHeader, readPointCsv, type PointFile, type PointOrder } from './point-csv';
export {
  LandXmlReader,
  readLandXml,
  readLandXmlStream,
  type LandXmlAlignment,
  type LandXmlBoundary,
  type LandXmlCrossSection,
  type LandXmlDocument,
  type LandXmlIssue,
  type LandXmlReadOptions,
  type LandXmlSectionLine,
  type LandXmlSurface,
} from './reader';
export { shownStation, type ShownStation, type StationEquation } from './stations';
export { factorTo, LANDXML_LENGTH_UNITS, METRES_PER_UNIT, type LandXmlLengthUnit, type LandXmlUnits } from './units';
