// The tracer's pure maths (no DOM, no Node APIs): calibration, colour tracing, contours, smoothing
// as the engine interpolates, and our CSV from traced points. Server storage: *.server.ts here.
export { calibrate, toData, toAxis, toPixel, axisToPixel, axisValue, TraceInputError, type AxisScale, type AxisRef, type GridRef, type Px, type Calibration, type CalibrationInput } from "./calibrate";
export { colourMask, colourAt, traceMask, traceIsland, normaliseBox, type Rgba, type Rgb, type Box, type TraceOptions } from "./mask";
export { crossings, contourGaps, contoursCrossing, startsInside, efficiencyFromContours, insideLevel, type Contour, type ContourGap, type Crossing } from "./contours";
export { cleanPoints, resample, valueAt, engineSmooth, type XY } from "./curves";
export { tracedCsv, tracedRows, impellerGiven, csvImpellerMm, inCsv, CSV_HEADER, type TracedSet, type TraceUnits, type Quantity } from "./to-csv";
export { refusedBlankKeys, type RefusedBlank } from "./blank-keys";
