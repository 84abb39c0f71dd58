// Field checks, public face for code that runs anywhere (server, browser, offline on the phone):
// the form codec, the pure evaluation, the stored result's type, the tolerance cross and the CSV.
// The database side is imported by name where it is used (records.server.ts, photos.server.ts):
// a `.server` module re-exported here would pull server code into the browser bundle.
export { evaluateCheck } from "./evaluate";
export { gradeById, type FrozenSelection } from "./frozen-curve";
export { verdictFor } from "./verdict-for";
export { deliveredSentence } from "./sentences";
export { SPEED_RANGE, measuredRpmText } from "./speed-range";
export {
  blankFields,
  DEFAULT_GRADE,
  DIAMETER_UNITS,
  ELEVATION_UNITS,
  FLOW_UNITS,
  inputPowerW,
  parseCheckFields,
  POWER_ACCURACY_MAX_PCT,
  POWER_UNITS,
  PRESSURE_UNITS,
  speedRpm,
  TEMPERATURE_UNITS,
  temperatureLimitsC,
  temperatureRangeText,
  VERDICT_TEXT,
  gradeRule,
  type CheckFields,
  type GaugeRef,
  type LiquidKind,
  type ParseResult,
  type Readings,
  type Verdict,
} from "./form";
export { FIELD_CHECK_FORMAT, verdictNote, type CheckResult, type Pt } from "./result";
export { MAX_CHECK_PHOTO_BYTES, MAX_PHOTO_BYTES, MAX_PHOTOS, photoLimitsText, photoProblem, tooLargeText } from "./photo-limits";
export { armDeviationText, crossOf, crossSentences, crossSummary, type CrossArm } from "./cross";
export { powerGradeOf, powerGradeSentences, powerGradeState, powerGradeSummary, type PowerGrade } from "./power-grade";
export { historyCsv, type CheckHistoryForCsv } from "./csv";
export { checkTimes, CLOCK_SLACK_S, type CheckTimes } from "./taken-at";
export { checkedHeadRefusal, headRefusal } from "./head-check";
export { listedVerdict, verdictRule, type ListedVerdict, type RuledVerdict } from "./listed-verdict";
export { judgeToday, ruledToday } from "./judged-today";
