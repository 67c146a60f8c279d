// heatledger public API: what an application needs (networks, circuits, simulation, stress,
// planners, replay, report builders), one export line per module, grouped by domain.
// test/index.test.ts pins this list. Building blocks behind it are in ./internal.ts.

// errors
export { InputError, formatInputProblem } from "./errors/InputError.js";
export type { InputErrorCode, InputProblem } from "./errors/InputError.js";

// structured text (YAML/JSON with line numbers) and field-by-field reading

// units
export { parseQuantity } from "./units/parseQuantity.js";

// thermal
export { constantPowerSegment, powerAt, segmentEnergy } from "./thermal/powerTrace.js";
export type { PowerTerm, PowerSegment, PowerTrace } from "./thermal/powerTrace.js";
export { steadyStateResistance } from "./thermal/ModalModel.js";
export type { ModalModel } from "./thermal/ModalModel.js";
export { fosterToModal } from "./thermal/fosterNetwork.js";
export type { FosterNetwork, FosterStage } from "./thermal/fosterNetwork.js";
export { cauerToModal, cauerToGraph } from "./thermal/cauerLadder.js";
export type { CauerLadder, CauerStage } from "./thermal/cauerLadder.js";
export { NETWORK_PARTS } from "./thermal/NetworkPart.js";
export type { NetworkPart } from "./thermal/NetworkPart.js";
export { graphToModal, AMBIENT_NODE } from "./thermal/thermalGraph.js";
export type { ThermalGraph, ThermalNode, ThermalLink } from "./thermal/thermalGraph.js";
export { zth, logSpacedTimes } from "./thermal/zth.js";
export { runThermalHistory, ThermalRun } from "./thermal/runThermalHistory.js";
export { networkToModal } from "./thermal/ThermalNetwork.js";
export type { ThermalNetwork } from "./thermal/ThermalNetwork.js";
export { parseNetwork, NETWORK_FORMS } from "./thermal/parseNetwork.js";
export { formatNetworkFile, networkToDocument } from "./thermal/formatNetworkFile.js";
export type { HistoryOptions, HistoryPoint, HistorySampling, HistorySummary } from "./thermal/runThermalHistory.js";
// thermal: networks from the data engineers have (fit, pulse rating, lumped)
export { fitFosterNetwork, FIT_DEFAULTS } from "./thermal/fitFosterNetwork.js";
export type { FitOptions, ResolvedFitOptions, FitCandidate, FosterFit } from "./thermal/fitFosterNetwork.js";
export { zthFromPulseRating, PULSE_RATING_ASSUMPTIONS } from "./thermal/zthFromPulseRating.js";
export type { PulseRatingRow, PulseRatingConditions } from "./thermal/zthFromPulseRating.js";
export { MATERIALS, materialPreset } from "./thermal/materials.js";
export type { MaterialPreset } from "./thermal/materials.js";
export { lumpedNetwork, adiabaticMass } from "./thermal/lumpedNetwork.js";
export type { LumpedMass, LumpedDescription } from "./thermal/lumpedNetwork.js";

// report (formatters return strings)
export { lineChart, CHART_DEFAULTS } from "./report/lineChart.js";
export type { ChartSeries, LineChartOptions } from "./report/lineChart.js";
export { formatCautions, reportCautions, GENERAL_CAUTION, LINEAR_MOSFET_CAUTION } from "./text/cautions.js";
export { describeNetwork } from "./report/describeNetwork.js";
export type { NetworkDescription, NetworkPairDescription } from "./report/describeNetwork.js";

// circuits
export { NO_BUS_LOAD } from "./circuits/BusLoad.js";
export type { BusLoad, BusLoadTerms } from "./circuits/BusLoad.js";
export { COMMON_COMPLETION_FRACTIONS } from "./circuits/resolveCompletion.js";
export type { ResolvedCompletion } from "./circuits/resolveCompletion.js";
export { chargeSeriesResistor } from "./circuits/chargeSeriesResistor.js";
export type { SeriesResistorParams } from "./circuits/chargeSeriesResistor.js";
export { dischargeVoltage } from "./circuits/dischargeVoltage.js";
export type { DischargePath } from "./circuits/dischargeVoltage.js";
export { validateProtection } from "./circuits/AttemptProtection.js";
export type { AttemptProtection, BusVoltageCheck, BusRiseCheck, OverCurrentTrip, I2tLimit, ProtectionFiring } from "./circuits/AttemptProtection.js";
export { fosterToCauer, FOSTER_TO_CAUER_ROUND_TRIP_TOLERANCE } from "./thermal/fosterToCauer.js";
export { modalToFoster } from "./thermal/modalToFoster.js";
export { chainNetworks } from "./thermal/chainNetworks.js";
export type { HeatsinkAssembly, MountedPart } from "./thermal/chainNetworks.js";
export { periodicSteadyState, PERIODIC_DEFAULTS } from "./thermal/periodicSteadyState.js";
export type { PeriodicCycle, PeriodicOptions, PeriodicResult } from "./thermal/periodicSteadyState.js";
export { sampleThermalHistory, SAMPLE_DEFAULTS } from "./thermal/sampleThermalHistory.js";
export type { SampledPoint, SampleOptions } from "./thermal/sampleThermalHistory.js";
// stress
export { DEFAULT_CYCLE_HYSTERESIS_K, TurningPointFilter } from "./stress/turningPoints.js";
export type { TurningPoint } from "./stress/turningPoints.js";
export { RainflowCounter, rainflow } from "./stress/rainflowCounter.js";
export type { RainflowCycle, RainflowMode, RainflowOptions } from "./stress/rainflowCounter.js";
export { validatePulseEnergyTable, interpolatePulseEnergy, checkPulseEnergy, pulseEnergyDeratingFactor, PULSE_ENERGY_DERATING_DEFAULTS } from "./stress/pulseEnergyRating.js";
export type { PulseEnergyPoint, PulseEnergyLookup, PulseEnergyCheck, PulseEnergyDerating, RatingStatus, TablePosition } from "./stress/pulseEnergyRating.js";
export { allowedDrainCurrentA, validateSoaTable, checkSoa, soaDeratingFactor } from "./stress/soaTable.js";
export type { SoaPoint, SoaCurve, SoaTable, OperatingPoint, SoaCheck, SoaWorstPoint, SoaDerating } from "./stress/soaTable.js";
export { CYCLE_QUANTITY_UNITS, CYCLE_QUANTITY_WORDS } from "./stress/LifetimeModel.js";
export type { CycleLoad, CycleQuantity, FittedInterval, FittedRange, LifetimeModel } from "./stress/LifetimeModel.js";
export { coffinMansonCycles, coffinMansonAccelerationFactor, coffinMansonModel } from "./stress/coffinManson.js";
export type { CoffinMansonParameters } from "./stress/coffinManson.js";
export { NORRIS_LANDZBERG_SNPB, norrisLandzbergCycles, norrisLandzbergAccelerationFactor, norrisLandzbergModel } from "./stress/norrisLandzberg.js";
export type { NorrisLandzbergParameters } from "./stress/norrisLandzberg.js";
export { LESIT_GAS_CONSTANT, LESIT_PUBLISHED, LESIT_FITTED, lesitCycles, lesitModel } from "./stress/lesit.js";
export type { LesitParameters } from "./stress/lesit.js";
export { CIPS2008_PUBLISHED, CIPS2008_FITTED, CIPS2008_PART_FITTED, cips2008Cycles, cips2008Model } from "./stress/cips2008.js";
export type { Cips2008Coefficients, Cips2008Part, Cips2008Parameters } from "./stress/cips2008.js";
export { DEFAULT_TOP_CYCLES, SECONDS_PER_YEAR, MinerAccumulator } from "./stress/minerDamage.js";
export type { DamagingCycle, ExtrapolatedQuantity, MinerDamage } from "./stress/minerDamage.js";
export { LIFETIME_MODEL_NAMES } from "./stress/stressKeysSchema.js";
export type { StressKeysInput } from "./stress/stressKeysSchema.js";
export { resolveStressConfig } from "./stress/resolveStressConfig.js";
export type { StressConfig, StressPartKind } from "./stress/resolveStressConfig.js";
export { LIFETIME_CAUTION } from "./text/stressCautions.js";
export { StressAssessment, assessStress } from "./stress/assessStress.js";
export { VERDICTS, VERDICT_ORDER, peakVerdict, worstVerdict, verdictExitStatus, ratingVerdict, verdictLine } from "./stress/Verdict.js";
export type { Verdict, VerdictRule } from "./stress/Verdict.js";
export type { StressEvent, TemperaturePoint, StressOptions, EventRatingCheck, CycleSummary, StressReport } from "./stress/assessStress.js";
export { formatStressSection } from "./report/formatStressSection.js";
export type { StressHistoryWords } from "./report/formatStressSection.js";
export { stressReportJson } from "./report/stressReportJson.js";
export type { StressJson } from "./report/stressReportJson.js";
export { CYCLES_CSV_COLUMNS, formatCyclesCsv } from "./report/formatCyclesCsv.js";
// profile (duty profiles: schema, loading, expansion, simulation)
export { EVENT_KEYS, FAULT_TYPES, ROLE_NAMES } from "./profile/profileSchema.js";
export type { ProfileInput, LoadInput, FaultInput, CircuitInput, PartInput, EventInput, SupervisionInput } from "./profile/profileSchema.js";
export { ATTEMPT_TIMING_DEFAULTS } from "./profile/attemptTiming.js";
export type { AttemptTiming } from "./profile/attemptTiming.js";
export { loadProfile } from "./profile/loadProfile.js";
export { PROFILE_DEFAULTS } from "./profile/profileDefaults.js";
export { defaultCircuitModels } from "./profile/defaultCircuitModels.js";
export { expandTimeline } from "./profile/expandTimeline.js";
export type { TimelineKind, TimelineEvent, TimelineGap, TimelineItem, ExpandOptions } from "./profile/expandTimeline.js";
export { simulateProfile } from "./profile/simulateProfile.js";
export type { PartVerdict, EventTemperatures, PartResult, SimulationResult, SimulateOptions } from "./profile/simulateProfile.js";

// report: simulation (the recorders a run feeds, then the builders that read them)
export { EventDigest, EVENT_DIGEST_DEFAULTS } from "./profile/EventDigest.js";
export { ProfileStress } from "./profile/ProfileStress.js";
export type { ProfileStressOptions, ProfileStressResult } from "./profile/ProfileStress.js";
export { PeakEnvelope } from "./report/PeakEnvelope.js";
export { formatSimulationText } from "./report/formatSimulationText.js";
export type { SimulationTextHeader } from "./report/formatSimulationText.js";
export { simulationJson } from "./report/simulationJson.js";
export { formatProfileStress } from "./report/formatProfileStress.js";
export type { ProfileStressTextOptions } from "./report/formatProfileStress.js";
export { simulationStressJson } from "./report/simulationStressJson.js";
export type { SimulationStressJson } from "./report/simulationStressJson.js";
export type { SimulationJson, JsonPartEvent } from "./report/simulationJson.js";
export { SimulationCsv } from "./report/SimulationCsv.js";
export { formatFosterFit } from "./report/formatFosterFit.js";
// replay (field event logs -> the profile's events -> history, first exceedance, damage to date)
export { LOG_WORDS, LOG_WORD_LIST, LOG_COLUMNS, MEASURED_PREFIX } from "./replay/logWords.js";
export type { LogWord, LogColumn } from "./replay/logWords.js";
export { parseEventLog } from "./replay/parseEventLog.js";
export { eventLogToEvents } from "./replay/eventLogToEvents.js";
export { replayEventLog, replayProfile } from "./replay/replayEventLog.js";
export type { ReplayResult } from "./replay/replayEventLog.js";
export { replayLog, replayShell } from "./replay/replayLog.js";
export type { LogReplay, ExceedanceLine } from "./replay/replayLog.js";
export type { TextSource } from "./replay/EventLogScanner.js";
export { textPieces } from "./replay/textPieces.js";
export type { MeasuredComparison, PartResiduals } from "./replay/MeasuredResiduals.js";
export { replaySummary, logReplaySummary } from "./report/replaySummary.js";
export type { ReplaySummary, ReplayPartSummary } from "./report/replaySummary.js";
// plan
export { PLAN_DEFAULTS } from "./retry/planDefaults.js";
export { resolveScenario, resolveCorners } from "./retry/RetryScenario.js";
export type { AttemptContext, AttemptOutcome, AttemptModel, DischargeModel, RetryScenario, ResolvedScenario } from "./retry/RetryScenario.js";
export { uniformBurst, backoffBurst } from "./retry/RetrySchedule.js";
export type { RetrySpacing, BurstPlan } from "./retry/RetrySchedule.js";
export { runRetryScenario } from "./retry/runRetryScenario.js";
export type { ScenarioRun } from "./retry/runRetryScenario.js";
export { cornerScenarios } from "./retry/cornerScenarios.js";
export type { CornerSpec } from "./retry/cornerScenarios.js";
export { minUniformInterval } from "./retry/minUniformInterval.js";
export type { IntervalScanOptions, UniformIntervalAnswer } from "./retry/minUniformInterval.js";
export { maxAttempts } from "./retry/maxAttempts.js";
export type { MaxAttemptsAnswer } from "./retry/maxAttempts.js";
export { minForeverInterval } from "./retry/minForeverInterval.js";
export type { ForeverIntervalAnswer } from "./retry/minForeverInterval.js";
export { fastestSchedule } from "./retry/fastestSchedule.js";
export type { FastestScheduleAnswer, FastestScheduleOptions, ScheduledAttempt } from "./retry/fastestSchedule.js";
export { backoffRule } from "./retry/backoffRule.js";
export type { BackoffRule, BackoffRuleAnswer, BackoffRuleOptions } from "./retry/backoffRule.js";
export { lockoutAfterBurst } from "./retry/lockoutAfterBurst.js";
export type { LockoutAnswer, LockoutOptions } from "./retry/lockoutAfterBurst.js";
export { lockoutMap } from "./retry/lockoutMap.js";
export type { LockoutMap, LockoutMapCell } from "./retry/lockoutMap.js";
export { lockoutMapCsv, lockoutMapHeatmap, LOCKOUT_MAP_SYMBOLS } from "./report/formatLockoutMap.js";
export { retryPolicyVerdict } from "./retry/retryPolicyVerdict.js";
export type { RetryPolicyVerdict } from "./retry/retryPolicyVerdict.js";
export { profileRetrySetup } from "./retry/profileRetrySetup.js";
export type { ProfileRetrySetup, RetryBlock } from "./retry/profileRetrySetup.js";
export { planRetries } from "./retry/planRetries.js";
export type { RetryPlanReport } from "./retry/planRetries.js";
export { formatRetryPlanText } from "./report/formatRetryPlanText.js";
export { retryPlanJson } from "./report/retryPlanJson.js";
// plan: sizing (heat capacity by the adiabatic bound and by inverting the profile; slowest charging element)
export { SIZE_DEFAULTS, SIZE_SCALE_SCOPES } from "./size/sizeDefaults.js";
export type { SizeScaleScope } from "./size/sizeDefaults.js";
export { sizeScaledNetwork } from "./size/sizeScaledNetwork.js";
export type { ScaledNetwork } from "./size/sizeScaledNetwork.js";
export { sizeHeatCapacity } from "./size/sizeHeatCapacity.js";
export type { HeatCapacitySizing, HeatCapacitySizingOptions, SizingWorstEvent, AdiabaticBound, CapacityInversion } from "./size/sizeHeatCapacity.js";
export { sizeChargingElement } from "./size/sizeChargingElement.js";
export type { ChargingElementSizing, ChargingElementKnob } from "./size/sizeChargingElement.js";
export { sizeProfile } from "./size/sizeProfile.js";
export type { SizeProfileOptions, SizingReport } from "./size/sizeProfile.js";
export { formatSizingText } from "./report/formatSizingText.js";
export { sizingJson } from "./report/sizingJson.js";
// firmware guard (modal model at the tick, may-start rule, fixed- and floating-point C export, test vectors)
export { GUARD_DEFAULTS, GUARD_NUMERICS } from "./guard/guardDefaults.js";
export type { GuardNumeric } from "./guard/guardDefaults.js";
export { planGuard } from "./guard/planGuard.js";
export type { GuardOptions, GuardReport, GuardConservatism } from "./guard/planGuard.js";
export { guardCSource } from "./guard/guardCSource.js";
export type { GuardCFiles, GuardCOrigin } from "./guard/guardCSource.js";
export { guardModelJson } from "./guard/guardModelJson.js";
export { guardVectorsJson } from "./guard/guardVectorsJson.js";
export { formatGuardText } from "./report/formatGuardText.js";
export { guardJson } from "./report/guardJson.js";
// plan: supervision (timeout window, early-abort checks, retry storms)
export { SUPERVISE_DEFAULTS } from "./supervise/superviseDefaults.js";
export { supervisePrecharge } from "./supervise/supervisePrecharge.js";
export type { HealthyCornerResult, TimeoutWindow, SupervisionEnvelope, RetryStorm, SupervisionReport } from "./supervise/supervisePrecharge.js";
export { formatSupervisionText } from "./report/formatSupervisionText.js";
export { supervisionJson } from "./report/supervisionJson.js";
export { chargeLinearMosfet, THRESHOLD_REFERENCE_TEMPERATURE_C } from "./circuits/chargeLinearMosfet.js";
export type { ChargeThermalContext } from "./circuits/ChargeThermalContext.js";
export { DEFAULT_LOOP_GAIN_WARNING } from "./circuits/ElectroThermalSummary.js";
export type { ElectroThermalSummary, ThermalRunaway } from "./circuits/ElectroThermalSummary.js";
export type { SquareLawPoint } from "./circuits/mosfetSquareLaw.js";
export { resistanceAt, curveResistance, validateResistanceCurve, FULL_CURVE_REFERENCE_C } from "./circuits/ResistanceCurve.js";
export type { ResistanceCurve } from "./circuits/ResistanceCurve.js";
export type { LinearMosfetParams } from "./circuits/chargeLinearMosfet.js";
export { chargeConverter } from "./circuits/chargeConverter.js";
export type { ConverterParams } from "./circuits/chargeConverter.js";
