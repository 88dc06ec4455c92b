export { versionFigures, versionFigureKeys, rateChangeSentence } from './version-figures';
export type { VersionFigure, VersionFigureKey } from './version-figures';
export { cautions, reportCautions, REPORT_CAUTIONS_TITLE } from './cautions';
export { reportDate } from './report-dates';
export { doneOn, trialsSentence } from './report-words';
