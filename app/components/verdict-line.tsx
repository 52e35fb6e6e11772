import type { EstimateView } from "~/lib/plan/estimate-view";
import { STATUS_LOOK } from "./status-look";

/** The verdict in one line, for the phone's sticky bar and the build sheet. */
export function VerdictLine({ view }: { view: EstimateView }) {
  const v = view.estimate.verdict;
  const look = STATUS_LOOK[v.status];
  return (
    <span className="font-bold">
      {look.icon} {look.word}: {v.headline}
    </span>
  );
}
