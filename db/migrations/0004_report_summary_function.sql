-- The headline figures of a stored verification report, the same as summarizeReport()
-- (server/maneuvers/build-report.ts; a test checks they agree). Lists read this small object from a
-- generated column instead of detoasting and parsing whole reports with their plot series.
-- IMMUTABLE is true here although jsonb_build_object is only STABLE in general: that is for argument
-- types whose text output depends on settings (dates); these arguments are jsonb and integers.
CREATE FUNCTION holonaut_report_summary(report jsonb) RETURNS jsonb
LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
  SELECT CASE WHEN jsonb_typeof(report) IS DISTINCT FROM 'object' THEN NULL ELSE jsonb_build_object(
    'durationS', report->'durationS',
    'targetErrorDeg', report->'target'->'errorDeg',
    'withinTolerance', report->'target'->'withinTolerance',
    'yprDeg', report->'final'->'yprDeg',
    'rangeViolationCount', CASE WHEN jsonb_typeof(report->'rangeViolations') = 'array' THEN jsonb_array_length(report->'rangeViolations') ELSE 0 END,
    'peakJointRateDegS', report->'peakJointRate'->'maxDegS',
    'withinRateLimit', report->'peakJointRate'->'withinLimit',
    'withinTimeBudget', report->'timeBudget'->'within'
  ) END
$$;
