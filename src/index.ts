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
export { advanceModalState, createModalState, createModalStepper, modalRise, STEPPER_CACHE_SIZE } from "./thermal/modalStep.js";
export type { ModalState, SourcePowers } from "./thermal/modalStep.js";
export { interiorPeaks, riseSlope, PEAK_GRID_POINTS } from "./thermal/segmentPeak.js";
export type { InteriorPeak } from "./thermal/segmentPeak.js";
export { traceSteps } from "./thermal/traceSteps.js";
export type { TimedStep } from "./thermal/traceSteps.js";
export { runThermalHistory } from "./thermal/runThermalHistory.js";
export { networkToModal } from "./thermal/ThermalNetwork.js";
export type { ThermalNetwork } from "./thermal/ThermalNetwork.js";
export { parseNetwork, NETWORK_FORMS } from "./thermal/parseNetwork.js";
export { formatNetworkFile, networkToDocument } from "./thermal/formatNetworkFile.js";
export type { HistoryOptions, HistoryPoint, HistorySummary } from "./thermal/runThermalHistory.js";
export { fosterToCauer, FOSTER_TO_CAUER_ROUND_TRIP_TOLERANCE, FOSTER_TO_CAUER_CHECK_TIMES } from "./thermal/fosterToCauer.js";
export { modalToFoster, UNOBSERVABLE_GAIN_FRACTION } from "./thermal/modalToFoster.js";
export { chainNetworks, HEATSINK_PREFIX } from "./thermal/chainNetworks.js";
export type { HeatsinkAssembly, MountedPart } from "./thermal/chainNetworks.js";
export { periodicSteadyState, PERIODIC_DEFAULTS } from "./thermal/periodicSteadyState.js";
export type { PeriodicCycle, PeriodicOptions, PeriodicResult } from "./thermal/periodicSteadyState.js";
export { referenceSuperposition } from "./thermal/referenceSuperposition.js";
export { sampleThermalHistory, SAMPLE_DEFAULTS } from "./thermal/sampleThermalHistory.js";
export type { SampledPoint, SampleOptions } from "./thermal/sampleThermalHistory.js";

// report (formatters return strings)
export { formatTable, formatNumber, formatDuration } from "./report/formatTable.js";
export type { TableColumn } from "./report/formatTable.js";
export { lineChart, CHART_DEFAULTS } from "./report/lineChart.js";
export type { ChartSeries, LineChartOptions } from "./report/lineChart.js";
export { formatCautions, wrapText, GENERAL_CAUTION, LINEAR_MOSFET_CAUTION } from "./report/cautions.js";
export { describeNetwork } from "./report/describeNetwork.js";
export type { NetworkDescription, NetworkPairDescription } from "./report/describeNetwork.js";
