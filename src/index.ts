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

// stress
export { DEFAULT_CYCLE_HYSTERESIS_K, TurningPointFilter } from "./stress/turningPoints.js";
export type { TurningPoint } from "./stress/turningPoints.js";
export { RainflowCounter, rainflow } from "./stress/rainflowCounter.js";
export type { RainflowCycle, RainflowMode, RainflowOptions } from "./stress/rainflowCounter.js";
export { equivalentPulseDurationS } from "./stress/equivalentPulseDuration.js";
export { validatePulseEnergyTable, interpolatePulseEnergy, checkPulseEnergy } from "./stress/pulseEnergyRating.js";
export type { PulseEnergyPoint, PulseEnergyLookup, PulseEnergyCheck, RatingStatus, TablePosition } from "./stress/pulseEnergyRating.js";
export { allowedDrainCurrentA, validateSoaTable, checkSoa } from "./stress/soaTable.js";
export type { SoaPoint, SoaCurve, SoaTable, OperatingPoint, SoaCheck, SoaWorstPoint } from "./stress/soaTable.js";
export { CELSIUS_TO_KELVIN, CYCLE_QUANTITY_UNITS, CYCLE_QUANTITY_WORDS, cycleQuantity, mergeFittedRange } from "./stress/LifetimeModel.js";
export type { CycleLoad, CycleQuantity, FittedInterval, FittedRange, LifetimeModel } from "./stress/LifetimeModel.js";
export { coffinMansonCycles, coffinMansonAccelerationFactor, coffinMansonModel } from "./stress/coffinManson.js";
export type { CoffinMansonParameters } from "./stress/coffinManson.js";
export { NORRIS_LANDZBERG_SNPB, norrisLandzbergCycles, norrisLandzbergAccelerationFactor, norrisLandzbergModel } from "./stress/norrisLandzberg.js";
export type { NorrisLandzbergParameters } from "./stress/norrisLandzberg.js";
export { MOLAR_GAS_CONSTANT, LESIT_PUBLISHED, LESIT_FITTED, lesitCycles, lesitModel } from "./stress/lesit.js";
export type { LesitParameters } from "./stress/lesit.js";
export { CIPS2008_PUBLISHED, CIPS2008_FITTED, CIPS2008_PART_FITTED, cips2008Cycles, cips2008Model } from "./stress/cips2008.js";
export type { Cips2008Coefficients, Cips2008Part, Cips2008Parameters } from "./stress/cips2008.js";
export { DEFAULT_TOP_CYCLES, SECONDS_PER_YEAR, MinerAccumulator } from "./stress/minerDamage.js";
export type { DamagingCycle, MinerDamage } from "./stress/minerDamage.js";
export { LIFETIME_MODEL_NAMES, stressKeysSchema } from "./stress/stressKeysSchema.js";
export type { StressKeysInput } from "./stress/stressKeysSchema.js";
export { resolveStressConfig } from "./stress/resolveStressConfig.js";
export type { StressConfig, StressPartKind } from "./stress/resolveStressConfig.js";
export { LIFETIME_CAUTION } from "./stress/stressCautions.js";
export { StressAssessment, assessStress, worseStatus } from "./stress/assessStress.js";
export type { StressEvent, TemperaturePoint, StressOptions, EventRatingCheck, CycleSummary, StressReport } from "./stress/assessStress.js";
export { formatStressSection, STRESS_SECTION_MAX_EVENTS, STRESS_SECTION_WIDTH } from "./stress/formatStressSection.js";
export { stressReportJson } from "./stress/stressReportJson.js";
export type { StressJson } from "./stress/stressReportJson.js";
export { CYCLES_CSV_COLUMNS, formatCyclesCsv } from "./stress/formatCyclesCsv.js";
