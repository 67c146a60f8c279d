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

// profile (duty profiles: schema, loading, expansion, simulation)
export { profileSchema, partSchema, circuitSchema, loadSchema, EVENT_KEYS, FAULT_TYPES, ROLE_NAMES } from "./profile/profileSchema.js";
export type { ProfileInput, LoadInput, FaultInput, CircuitInput, PartInput, EventInput } from "./profile/profileSchema.js";
export type { BusLoad, DischargePath, CircuitRole, ProfileCircuit, ProfilePart, FaultSpec, ProfileEvent, DutyProfile } from "./profile/DutyProfile.js";
export { loadProfile, expandedEventBound, PROFILE_DEFAULTS } from "./profile/loadProfile.js";
export type { ReadNamedFile } from "./profile/loadProfile.js";
export { powerTracePoints, pointsToSegments } from "./profile/powerTracePoints.js";
export type { PowerTracePoints } from "./profile/powerTracePoints.js";
export type { CircuitModels } from "./profile/CircuitModels.js";
export { defaultCircuitModels } from "./profile/defaultCircuitModels.js";
export { expandTimeline } from "./profile/expandTimeline.js";
export type { TimelineKind, TimelineEvent, TimelineGap, TimelineItem, ExpandOptions } from "./profile/expandTimeline.js";
export { simulateProfile, combinedModel } from "./profile/simulateProfile.js";
export type { PartVerdict, EventTemperatures, PartResult, SimulationResult, SimulateOptions } from "./profile/simulateProfile.js";

// report: simulation
export { EventDigest, EVENT_DIGEST_DEFAULTS } from "./report/EventDigest.js";
export type { EventRecord } from "./report/EventDigest.js";
export { PeakEnvelope } from "./report/PeakEnvelope.js";
export { formatSimulationText } from "./report/formatSimulationText.js";
export { simulationJson } from "./report/simulationJson.js";
export type { SimulationJson, JsonPartEvent } from "./report/simulationJson.js";
export { SimulationCsv } from "./report/SimulationCsv.js";
