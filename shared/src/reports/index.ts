export { versionFigures, versionFigureKeys, rateChangeSentence } from './version-figures';
export type { VersionFigure, VersionFigureKey } from './version-figures';
