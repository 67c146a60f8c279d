// heatledger public API: one export line per module, grouped by domain. test/index.test.ts pins this list.

// errors
export { InputError, inputError, formatInputProblem, withLocation, describeFound } from "./errors/InputError.js";
export type { InputErrorCode, InputProblem } from "./errors/InputError.js";
export { editDistance, nearestKey, unknownKeyExpectation } from "./errors/nearestKey.js";

// structured text (YAML/JSON with line numbers) and field-by-field reading
export { parseStructuredText, splitFieldPath } from "./format/parseStructuredText.js";
export type { StructuredText } from "./format/parseStructuredText.js";
export { FieldReader, join } from "./format/FieldReader.js";

// units
export { parseQuantity } from "./units/parseQuantity.js";
export { DIMENSIONS, expectedWords } from "./units/dimensions.js";
export type { Dimension } from "./units/dimensions.js";

// thermal
export { expIntegral0, expIntegral1 } from "./thermal/expIntegrals.js";
export { constantPowerSegment, powerAt, segmentEnergy, shiftTerms, validatePowerTrace } from "./thermal/powerTrace.js";
export type { PowerTerm, PowerSegment, PowerTrace } from "./thermal/powerTrace.js";
export { validateModalModel, sourceIndex, observedIndex, steadyStateResistance } from "./thermal/ModalModel.js";
export type { ModalModel } from "./thermal/ModalModel.js";
export { fosterToModal, validateFoster } from "./thermal/fosterNetwork.js";
export type { FosterNetwork, FosterStage } from "./thermal/fosterNetwork.js";
export { cauerToModal, cauerToGraph, cauerNodeName } from "./thermal/cauerLadder.js";
export type { CauerLadder, CauerStage } from "./thermal/cauerLadder.js";
export { graphToModal, AMBIENT_NODE } from "./thermal/thermalGraph.js";
export type { ThermalGraph, ThermalNode, ThermalLink } from "./thermal/thermalGraph.js";
export { symmetricEigen } from "./thermal/symmetricEigen.js";
export type { SymmetricEigen } from "./thermal/symmetricEigen.js";
export { zth, logSpacedTimes } from "./thermal/zth.js";
export { advanceModalState, createModalState, createModalStepper, modalRise } from "./thermal/modalStep.js";
export type { ModalState, SourcePowers } from "./thermal/modalStep.js";
export { interiorPeaks, PEAK_GRID_POINTS } from "./thermal/segmentPeak.js";
export type { InteriorPeak } from "./thermal/segmentPeak.js";
export { traceSteps } from "./thermal/traceSteps.js";
export type { TimedStep } from "./thermal/traceSteps.js";
export { runThermalHistory } from "./thermal/runThermalHistory.js";
export { networkToModal } from "./thermal/ThermalNetwork.js";
export type { ThermalNetwork } from "./thermal/ThermalNetwork.js";
export { parseNetwork, NETWORK_FORMS } from "./thermal/parseNetwork.js";
export { formatNetworkFile, networkToDocument } from "./thermal/formatNetworkFile.js";
export type { HistoryOptions, HistoryPoint, HistorySummary } from "./thermal/runThermalHistory.js";

// report (formatters return strings)
export { formatTable, formatNumber, formatDuration } from "./report/formatTable.js";
export type { TableColumn } from "./report/formatTable.js";
export { lineChart, CHART_DEFAULTS } from "./report/lineChart.js";
export type { ChartSeries, LineChartOptions } from "./report/lineChart.js";
export { formatCautions, wrapText, GENERAL_CAUTION, LINEAR_MOSFET_CAUTION } from "./report/cautions.js";
export { describeNetwork } from "./report/describeNetwork.js";
export type { NetworkDescription, NetworkPairDescription } from "./report/describeNetwork.js";

// plan
export { PLAN_DEFAULTS } from "./plan/planDefaults.js";
export { resolveScenario, resolveCorners } from "./plan/RetryScenario.js";
export type { AttemptContext, AttemptOutcome, AttemptModel, DischargeModel, RetryScenario, ResolvedScenario } from "./plan/RetryScenario.js";
export { uniformBurst } from "./plan/RetrySchedule.js";
export type { RetrySpacing, BurstPlan } from "./plan/RetrySchedule.js";
export { AttemptCursor } from "./plan/AttemptCursor.js";
export type { AttemptRecord, AttemptTrial } from "./plan/AttemptCursor.js";
export { runBurst } from "./plan/runBurst.js";
export type { BurstRun } from "./plan/runBurst.js";
export { runRetryScenario } from "./plan/runRetryScenario.js";
export type { ScenarioRun } from "./plan/runRetryScenario.js";
export { scanFeasibleBands, scanGrid } from "./plan/scanFeasibleBands.js";
export type { FeasibleBand, BandScan } from "./plan/scanFeasibleBands.js";
export { governingCorner } from "./plan/GoverningCorner.js";
export type { GoverningCorner } from "./plan/GoverningCorner.js";
export { cornerScenarios } from "./plan/cornerScenarios.js";
export type { CornerSpec } from "./plan/cornerScenarios.js";
export { minUniformInterval } from "./plan/minUniformInterval.js";
export type { IntervalScanOptions, UniformIntervalAnswer } from "./plan/minUniformInterval.js";
export { maxAttempts } from "./plan/maxAttempts.js";
export type { MaxAttemptsAnswer } from "./plan/maxAttempts.js";
export { periodicSteadyState } from "./plan/periodicSteadyState.js";
export type { PeriodicSteadyState } from "./plan/periodicSteadyState.js";
export { retryForeverCheck } from "./plan/retryForeverCheck.js";
export type { ForeverVerdict } from "./plan/retryForeverCheck.js";
export { minForeverInterval } from "./plan/minForeverInterval.js";
export type { ForeverIntervalAnswer } from "./plan/minForeverInterval.js";
export { fastestSchedule } from "./plan/fastestSchedule.js";
export type { FastestScheduleAnswer, FastestScheduleOptions, ScheduledAttempt } from "./plan/fastestSchedule.js";
export { backoffRule, firstWaitCandidates } from "./plan/backoffRule.js";
export type { BackoffRule, BackoffRuleAnswer, BackoffRuleOptions } from "./plan/backoffRule.js";
export { lockoutAfterBurst } from "./plan/lockoutAfterBurst.js";
export type { LockoutAnswer, LockoutOptions } from "./plan/lockoutAfterBurst.js";
export { lockoutMap } from "./plan/lockoutMap.js";
export type { LockoutMap, LockoutMapCell } from "./plan/lockoutMap.js";
export { lockoutMapCsv, lockoutMapHeatmap, LOCKOUT_MAP_SYMBOLS } from "./plan/formatLockoutMap.js";
