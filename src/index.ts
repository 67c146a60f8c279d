// heatledger public API: one export line per module, grouped by domain. test/index.test.ts pins this list.

// errors
export { InputError, inputError, formatInputProblem, withLocation, describeFound } from "./errors/InputError.js";
export type { InputErrorCode, InputProblem } from "./errors/InputError.js";
export { editDistance, nearestKey, unknownKeyExpectation } from "./errors/nearestKey.js";

// structured text (YAML/JSON with line numbers) and field-by-field reading
export { parseStructuredText, splitFieldPath } from "./format/parseStructuredText.js";
export type { StructuredText } from "./format/parseStructuredText.js";
export { FieldReader, join } from "./format/FieldReader.js";
export { parseQuantityTable } from "./format/parseQuantityTable.js";
export type { QuantityColumn, QuantityTable } from "./format/parseQuantityTable.js";

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
// thermal: networks from the data engineers have (fit, pulse rating, lumped)
export { validateZthPoints } from "./thermal/fitZthPoints.js";
export type { ZthPoint } from "./thermal/fitZthPoints.js";
export { fitNnlsSpectrum, nonNegativeResistances } from "./thermal/fitNnlsSpectrum.js";
export type { NnlsSpectrumSettings } from "./thermal/fitNnlsSpectrum.js";
export { refineFosterFit } from "./thermal/fitRefineFoster.js";
export type { RefineSettings, RefinedFoster } from "./thermal/fitRefineFoster.js";
export { fitCriterion, FIT_CRITERIA } from "./thermal/fitCriterion.js";
export type { FitCriterion } from "./thermal/fitCriterion.js";
export { fitRelativeErrors } from "./thermal/fitRelativeErrors.js";
export type { FitRelativeErrors } from "./thermal/fitRelativeErrors.js";
export { fitFosterNetwork, resolveFitOptions, FIT_DEFAULTS, FIT_MISS_WARNING } from "./thermal/fitFosterNetwork.js";
export type { FitOptions, ResolvedFitOptions, FitCandidate, FosterFit } from "./thermal/fitFosterNetwork.js";
export { zthFromPulseRating, PULSE_RATING_ASSUMPTIONS } from "./thermal/zthFromPulseRating.js";
export type { PulseRatingRow, PulseRatingConditions } from "./thermal/zthFromPulseRating.js";
export { MATERIALS, materialPreset } from "./thermal/materials.js";
export type { MaterialPreset } from "./thermal/materials.js";
export { lumpedNetwork, adiabaticMass } from "./thermal/lumpedNetwork.js";
export type { LumpedMass, LumpedDescription } from "./thermal/lumpedNetwork.js";

// report (formatters return strings)
export { formatTable, formatNumber, formatDuration } from "./report/formatTable.js";
export type { TableColumn } from "./report/formatTable.js";
export { lineChart, CHART_DEFAULTS } from "./report/lineChart.js";
export type { ChartSeries, LineChartOptions } from "./report/lineChart.js";
export { formatCautions, wrapText, GENERAL_CAUTION, LINEAR_MOSFET_CAUTION } from "./report/cautions.js";
export { describeNetwork } from "./report/describeNetwork.js";
export type { NetworkDescription, NetworkPairDescription } from "./report/describeNetwork.js";

// circuits
export type { ChargeConditions, CompletionRule, CircuitOutcome, CircuitResult, CircuitSample, EnergyBalance } from "./circuits/CircuitResult.js";
export { NO_BUS_LOAD, validateBusLoad, busLoadThresholds, busLoadStartsOn, busLoadTerms } from "./circuits/BusLoad.js";
export type { BusLoad, BusLoadTerms } from "./circuits/BusLoad.js";
export { ZERO_QUADRATIC, evalQuadratic } from "./circuits/BusRegime.js";
export type { Quadratic, BusLevel, FeedTerms, BusRegime, ChargeModel } from "./circuits/BusRegime.js";
export { resolveCompletion } from "./circuits/resolveCompletion.js";
export type { ResolvedCompletion } from "./circuits/resolveCompletion.js";
export { runChargeEvent, buildRegime, SAMPLES_PER_STRETCH, MAX_REGIME_CHANGES } from "./circuits/runChargeEvent.js";
export { integrateBusOde, NONLINEAR_ACCURACY } from "./circuits/integrateBusOde.js";
export type { RegimeStretch } from "./circuits/integrateBusOde.js";
export { chargeSeriesResistor } from "./circuits/chargeSeriesResistor.js";
export type { SeriesResistorParams } from "./circuits/chargeSeriesResistor.js";
export { dischargeVoltage } from "./circuits/dischargeVoltage.js";
export type { DischargePath } from "./circuits/dischargeVoltage.js";
export { fosterToCauer, FOSTER_TO_CAUER_ROUND_TRIP_TOLERANCE, FOSTER_TO_CAUER_CHECK_TIMES } from "./thermal/fosterToCauer.js";
export { modalToFoster, UNOBSERVABLE_GAIN_FRACTION } from "./thermal/modalToFoster.js";
export { chainNetworks, HEATSINK_PREFIX } from "./thermal/chainNetworks.js";
export type { HeatsinkAssembly, MountedPart } from "./thermal/chainNetworks.js";
export { periodicSteadyState, PERIODIC_DEFAULTS } from "./thermal/periodicSteadyState.js";
export type { PeriodicCycle, PeriodicOptions, PeriodicResult } from "./thermal/periodicSteadyState.js";
export { referenceSuperposition } from "./thermal/referenceSuperposition.js";
export { sampleThermalHistory, SAMPLE_DEFAULTS } from "./thermal/sampleThermalHistory.js";
export type { SampledPoint, SampleOptions } from "./thermal/sampleThermalHistory.js";
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
export { CELSIUS_TO_KELVIN, CYCLE_QUANTITY_UNITS, cycleQuantity, mergeFittedRange } from "./stress/LifetimeModel.js";
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
export { formatStressSection } from "./stress/formatStressSection.js";
export { stressReportJson } from "./stress/stressReportJson.js";
export type { StressJson } from "./stress/stressReportJson.js";
export { CYCLES_CSV_COLUMNS, formatCyclesCsv } from "./stress/formatCyclesCsv.js";
// profile (duty profiles: schema, loading, expansion, simulation)
export { profileSchema, partSchema, circuitSchema, loadSchema, EVENT_KEYS, FAULT_TYPES, ROLE_NAMES } from "./profile/profileSchema.js";
export type { ProfileInput, LoadInput, FaultInput, CircuitInput, PartInput, EventInput } from "./profile/profileSchema.js";
export type { CircuitRole, ProfileCircuit, ProfilePart, FaultSpec, ProfileEvent, DutyProfile } from "./profile/DutyProfile.js";
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
export { formatFosterFit } from "./report/formatFosterFit.js";
// plan
export { PLAN_DEFAULTS } from "./plan/planDefaults.js";
export { resolveScenario, resolveCorners } from "./plan/RetryScenario.js";
export type { AttemptContext, AttemptOutcome, AttemptModel, DischargeModel, RetryScenario, ResolvedScenario } from "./plan/RetryScenario.js";
export { uniformBurst, backoffBurst } from "./plan/RetrySchedule.js";
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
export { attemptPeriodicSteadyState } from "./plan/attemptPeriodicSteadyState.js";
export type { AttemptPeriodicState } from "./plan/attemptPeriodicSteadyState.js";
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
export { burstAsAttempt } from "./plan/burstAsAttempt.js";
export { retryPolicyVerdict } from "./plan/retryPolicyVerdict.js";
export type { RetryPolicyVerdict } from "./plan/retryPolicyVerdict.js";
