// The plan editor's live estimate. As the builder types, the clamp model runs here in the browser (it is
// pure; it and the form's schema load just after the first paint) for the immediate figures: verdict,
// margins, ceiling. Only the slow parts,
// the torque sweep and the scatter run, come from POST /api/v1/estimate, a short pause after the last
// keystroke, and a newer keystroke cancels the request in flight. Without JavaScript the form posts.
import { useEffect, useMemo, useRef, useState } from "react";
import type { PlanInput } from "~/lib/clamp";
import {
  assembleTorqueInput,
  gasketFitProblem,
  plannedByStretch,
  type EngineRecord,
  type FastenerRecord,
  type GasketRecord,
  type MaterialRecord,
} from "~/lib/plan/parts";
import type { EstimateView } from "~/lib/plan/estimate-view";
import { formatQuantity, type UnitSystem } from "~/lib/units";

/** Pause after the last keystroke before the sweep and scatter run are fetched. */
export const SLOW_PART_DEBOUNCE_MS = 150;

type ApiAnswer = EstimateView | { error: string; errors?: { path: string; message: string }[] };

/** What the editor's loader gives the hook (plain data). */
export interface LiveEstimateData {
  units: UnitSystem;
  engine: EngineRecord;
  materials: { head: MaterialRecord | null; block: MaterialRecord | null; sleeve: MaterialRecord | null };
  choices: { fasteners: (FastenerRecord & { id: number })[]; gaskets: (GasketRecord & { id: number })[] };
}

// the module is loaded after first paint (dynamic import below); only its type is needed here
// eslint-disable-next-line @typescript-eslint/consistent-type-imports
type LiveEvaluation = typeof import("~/lib/plan/live-evaluation");

interface StepBase {
  fastenerId: string;
  errors: Record<string, string> | null;
}
/** What one reading of the form gives: figures, or why there are none (yet). */
type LiveStep =
  | (StepBase & { kind: "unreadable" | "incomplete" | "waiting" })
  | (StepBase & { kind: "figures"; live: ReturnType<LiveEvaluation["liveFigures"]>; byStretch: boolean });

/** Run when the browser is idle (soon, where it cannot say). */
function whenIdle(run: () => void) {
  if (typeof requestIdleCallback === "function") requestIdleCallback(run, { timeout: 2000 });
  else setTimeout(run, 200);
}

export function useLiveEstimate(d: LiveEstimateData, saved: EstimateView | null) {
  const formRef = useRef<HTMLFormElement>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const inFlight = useRef<AbortController | null>(null);
  const [errors, setErrors] = useState<Record<string, string> | null>(null);
  const [fastenerId, setFastenerId] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const [view, setView] = useState<EstimateView | null>(null);
  const [problems, setProblems] = useState<string[] | null>(null);
  const [slowPending, setSlowPending] = useState(false);
  // the stud stiffness and the target of the inputs last evaluated, to word the stretch beside the torque
  const [stud, setStud] = useState<{ stiffnessNPerMm: number | null; byStretch: boolean } | null>(null);
  const lastFull = useRef<EstimateView | null>(saved);
  // the model for the immediate figures, fetched once the page is up (not with its first JavaScript)
  const model = useRef<LiveEvaluation | null>(null);
  const loading = useRef<Promise<LiveEvaluation> | null>(null);
  const loadModel = () => (loading.current ??= import("~/lib/plan/live-evaluation").then((m) => (model.current = m)));
  useEffect(() => {
    // once loaded, run the model once on the form as it stands while the page is idle: the first
    // keystroke then finds the model's code compiled (cold, it costs several times a warm evaluation)
    void loadModel().then(() => whenIdle(() => figuresFor(formRef.current)));
  }, []);
  useEffect(
    () => () => {
      clearTimeout(timer.current);
      inFlight.current?.abort();
    },
    [],
  );

  const fetchSlowParts = (input: PlanInput) => {
    clearTimeout(timer.current);
    // the request for the inputs before this keystroke is stale now, not only once the next one is sent:
    // its answer must not replace the figures of the inputs shown
    inFlight.current?.abort();
    inFlight.current = null;
    timer.current = setTimeout(async () => {
      const controller = new AbortController();
      inFlight.current = controller;
      try {
        const res = await fetch("/api/v1/estimate", {
          method: "POST",
          headers: { "Content-Type": "application/json", Accept: "application/json" },
          body: JSON.stringify({ input, units: d.units }),
          signal: controller.signal,
        });
        const answer = (await res.json()) as ApiAnswer;
        if (controller.signal.aborted) return;
        if ("estimate" in answer) {
          lastFull.current = answer;
          setView(answer);
          setProblems(null);
        } else setProblems(answer.errors?.map((e) => e.message) ?? [answer.error]);
      } catch (e) {
        // a newer keystroke cancelled this one; anything else leaves the immediate figures standing
        if ((e as Error).name === "AbortError") return;
      } finally {
        if (inFlight.current === controller) {
          inFlight.current = null;
          setSlowPending(false);
        }
      }
    }, SLOW_PART_DEBOUNCE_MS);
  };

  /** The form read and, with the model loaded, evaluated; the caller puts the outcome on the page. */
  const figuresFor = (formEl: HTMLFormElement | null): LiveStep | null => {
    if (!formEl) return null;
    const form = Object.fromEntries(new FormData(formEl));
    // the form's schema and the model load together after the first paint: a change in the first
    // instant of the page waits for them
    const m = model.current;
    if (!m) return { fastenerId: String(form.fastenerId ?? ""), errors: null, kind: "waiting" };
    const full = m.parsePlanForm(form, d.units);
    // Stages do not change the estimate, so a half-typed stage list does not hold it back.
    const parsed = full.ok ? full : m.parsePlanForm({ ...form, stages: "" }, d.units);
    const base = { fastenerId: String(form.fastenerId ?? ""), errors: full.ok ? null : full.errors };
    if (!parsed.ok) return { ...base, kind: "unreadable" };
    const fastener = d.choices.fasteners.find((f) => f.id === parsed.plan.fastenerId);
    const gasket = d.choices.gaskets.find((g) => g.id === parsed.plan.gasketId);
    if (!fastener || !gasket || !d.materials.head || !d.materials.block) return { ...base, kind: "incomplete" };
    const misfit = gasketFitProblem(d.engine.boreMm, gasket.boreMm, (mm) => formatQuantity(mm, "length", d.units));
    if (misfit) return { ...base, kind: "unreadable", errors: { ...base.errors, gasketId: misfit } };
    const plan = parsed.plan;
    const byStretch = plannedByStretch(plan);
    const torqueInput = assembleTorqueInput({
      engine: d.engine,
      plan,
      fastener,
      gasket,
      head: d.materials.head,
      block: d.materials.block,
      sleeve: d.materials.sleeve,
    });
    // one validation and one prepare for the stiffness, the stretch target's preload and the evaluation
    const live = m.liveFigures(torqueInput, byStretch ? plan.targetStretchMm : null, lastFull.current, d.units);
    return { ...base, kind: "figures", live, byStretch };
  };

  const onChange = () => {
    const step = figuresFor(formRef.current);
    if (!step) return;
    setFastenerId(step.fastenerId);
    setErrors(step.errors);
    setStale(step.kind === "unreadable");
    if (step.kind !== "figures") {
      // the model is on its way: this runs again on the form as it is by then
      if (step.kind === "waiting") {
        setSlowPending(true);
        void loadModel().then(onChange);
      }
      return;
    }
    setSlowPending(true);
    const { live, byStretch } = step;
    setStud({ stiffnessNPerMm: live.stiffnessNPerMm, byStretch });
    // the server words the model's own refusals
    if (!live.input) return fetchSlowParts(live.raw as PlanInput);
    if (live.view) {
      setView(live.view);
      setProblems(null);
    }
    fetchSlowParts(live.input);
  };

  return useMemo(() => {
    const stretchLine = model.current?.stretchLine;
    const stretch =
      view && stud && stretchLine
        ? stretchLine(stud.byStretch ? "stretch" : "torque", view.estimate.tightening.preload.nominalN, view.torqueNm, stud.stiffnessNPerMm)
        : null;
    // busy: the sweep and the scatter run shown are not yet these inputs' (the figures above them are)
    return { onChange, formRef, errors, fastenerId, stale, busy: slowPending, view, problems, stretch };
  }, [view, problems, slowPending, errors, fastenerId, stale, stud]);
}
