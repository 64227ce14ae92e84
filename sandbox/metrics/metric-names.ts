/** Metric names as they appear in the evaluator's JSON and the API (numerics.md, "Metrics per routine"). */
export const metricNames = [
  'factorRatio',
  'componentwiseBoundRatio',
  'growthFactor',
  'orthogonalityRatio',
  'solveResidualRatio',
  'normwiseBackwardError',
  'componentwiseBackwardError',
  'forwardError',
  'forwardErrorOverBound',
] as const;
export type MetricName = (typeof metricNames)[number];

/** Values a kernel earned on one matrix; a metric that does not apply is absent. */
export type Metrics = Partial<Record<MetricName, number>>;
