/**
 * The core's types the page draws from (types only: the page computes no statistics).
 * One place, so a move of the core's public entry changes one line here.
 */
export type {
  AnalysisReport,
  DatasetReport,
  GroupedDatasetReport,
  GroupedCandidateReport,
  DatasetCandidate,
  CandidateReport,
  NotApplicableReport,
  ChiSquareReport,
  ChiSquareComputed,
  AndersonDarlingReport,
  BinRow,
  MethodNote,
  PMethod,
  FamilyName,
  SkipCount,
  SkipReason,
  Evidence,
  CandidateEvidence,
  FittedCurves,
  FittedCurve,
  CdfEvidence,
  HistogramEvidence,
  HistogramBar,
  BinCountsEvidence,
  BinCountsRow,
  ProbabilityPlotEvidence,
  ProbabilityTick,
} from '../../core/index.js';
