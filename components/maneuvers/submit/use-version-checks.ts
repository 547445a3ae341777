import { useVersionRobustnessQuery } from '@/components/api/use-robustness';
import type { VersionDetail } from '@/shared/contracts/maneuver';
import type { RobustnessRun } from '@/shared/contracts/robustness-run';
import { type CheckFailure,versionCheckFailures } from '@/shared/product/version-checks';

/** The checks of a version as the server applies them at submit (its report and its newest robustness run). */
export interface VersionChecks {
  /** Failed checks, in the server's order and words; empty when the version passes. */
  failures: CheckFailure[];
  /** The newest robustness run (null: none), polled while it runs. */
  robustness: RobustnessRun | null;
  /** Still loading the robustness run: the failures are not known yet. */
  pending: boolean;
}

/** The checks of `version` now (shared/product/version-checks.ts), with its robustness run polled. */
export function useVersionChecks(version: VersionDetail): VersionChecks {
  const run = useVersionRobustnessQuery(version.id);
  const robustness = run.data ?? null;
  return {
    failures: versionCheckFailures(version.report, robustness),
    robustness,
    pending: run.isPending,
  };
}
