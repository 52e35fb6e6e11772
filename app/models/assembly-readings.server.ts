import { preloadFromTorque } from "~/lib/clamp";
import { impliedPreloads, type AssemblyRecord, type ImpliedPreload } from "~/lib/records/assembly";
import { learnFriction, preloadShift, type FrictionObservation, type LearnedFriction } from "~/lib/records/friction";
import { withTeam } from "~/utils/db.server";
import { getEngine, type EngineRow } from "./engine.server";
import { evaluateAtFiring } from "./plan-at-pressure.server";
import { listPlans, type PlanRow } from "./plan.server";
import { toAssembly } from "./records.server";

// What an assembly's measurements say through the clamp model: the preload each measured stretch
// implies (the model's stud stiffness), beside what the model predicted for the torque reached; and,
// across the team, the friction those assemblies teach per fastener and lubricant.

export interface AssemblyReading {
  assemblyId: number;
  studStiffnessNPerMm: number | null;
  predictedPreloadN: number | null;
  studs: ImpliedPreload[];
  /** Mean implied preload over the studs measured. */
  meanImpliedN: number | null;
  problem: string | null;
}

export async function assemblyReadings(
  teamId: number,
  engine: EngineRow,
  assemblies: AssemblyRecord[],
  plans: PlanRow[],
): Promise<AssemblyReading[]> {
  const out: AssemblyReading[] = [];
  for (const a of assemblies) {
    const plan = plans.find((p) => p.id === a.planId);
    const at = plan ? await evaluateAtFiring(teamId, engine, plan) : null;
    if (!at || !at.ok) {
      out.push({
        assemblyId: a.id,
        studStiffnessNPerMm: null,
        predictedPreloadN: null,
        studs: [],
        meanImpliedN: null,
        problem: at && !at.ok ? at.problems.join(" ") : "Its plan has been archived.",
      });
      continue;
    }
    const k = at.prepared.stud.stiffnessNPerMm;
    const predicted = a.finalTorqueNm ? preloadFromTorque(a.finalTorqueNm, at.prepared.torqueGeometry, at.prepared.friction) : null;
    const studs = impliedPreloads(a.studStretch, k, predicted);
    out.push({
      assemblyId: a.id,
      studStiffnessNPerMm: k,
      predictedPreloadN: predicted,
      studs,
      meanImpliedN: studs.length ? studs.reduce((s, x) => s + x.impliedPreloadN, 0) / studs.length : null,
      problem: null,
    });
  }
  return out;
}

export interface LearnedFor {
  fastenerId: number;
  fastenerName: string;
  lubricant: string;
  learned: LearnedFriction;
  /** At the maker's torque (or the plan's when the maker gives none): handbook against learned preload. */
  shift: (ReturnType<typeof preloadShift> & { torqueNm: number; fromMaker: boolean }) | null;
}

const lubeKey = (s: string) => s.trim().toLowerCase();

/** The team's learned friction per fastener + lubricant, from every assembly with stretch at a known torque. */
export async function learnedFrictions(teamId: number): Promise<LearnedFor[]> {
  const rows = await withTeam(teamId, (k) =>
    k("assemblies as a")
      .join("seal_plans as p", "p.id", "a.plan_id")
      .join("fasteners as f", "f.id", "p.fastener_id")
      .where("a.team_id", teamId)
      .where("p.team_id", teamId)
      .whereNotNull("a.final_torque_nm")
      .whereNot("a.stud_stretch", "[]")
      .select(
        "a.*",
        "p.fastener_id",
        "f.name as fastener_name",
        "f.maker_torque_nm",
        "f.thread_friction as hb_thread",
        "f.bearing_friction as hb_bearing",
      ),
  );
  const groups = new Map<
    string,
    { rows: typeof rows; obs: FrictionObservation[]; geometry: FrictionObservation["geometry"] | null; d: number }
  >();
  // learning reads every assembly of the shop (an aggregate the builder sees), not one person's view
  const wholeShop = { teamId, userId: 0, role: "owner" } as const;
  const engines = new Map<number, EngineRow | null>();
  const plansOf = new Map<number, PlanRow[]>();
  for (const r of rows) {
    const a = toAssembly(r);
    if (!engines.has(a.engineId)) engines.set(a.engineId, await getEngine(wholeShop, a.engineId));
    const engine = engines.get(a.engineId);
    if (!engine) continue;
    if (!plansOf.has(engine.id)) plansOf.set(engine.id, await listPlans(teamId, engine.id));
    const plan = plansOf.get(engine.id)!.find((p) => p.id === a.planId);
    if (!plan) continue;
    const at = await evaluateAtFiring(teamId, engine, plan);
    if (!at.ok || a.studStretch.length === 0 || !a.finalTorqueNm) continue;
    const implied = impliedPreloads(a.studStretch, at.prepared.stud.stiffnessNPerMm, null);
    const meanN = implied.reduce((sum, x) => sum + x.impliedPreloadN, 0) / implied.length;
    const key = `${r.fastener_id}\u0000${lubeKey(a.lubricant)}`;
    const g = groups.get(key) ?? { rows: [], obs: [], geometry: at.prepared.torqueGeometry, d: at.prepared.plan.fastener.diameterMm };
    g.rows.push(r);
    g.obs.push({
      torqueNm: a.finalTorqueNm,
      observedPreloadN: meanN,
      geometry: at.prepared.torqueGeometry,
      diameterMm: at.prepared.plan.fastener.diameterMm,
    });
    groups.set(key, g);
  }
  return [...groups.values()].map((g) => {
    const first = g.rows[0]!;
    const learned = learnFriction(g.obs);
    const torqueNm = first.maker_torque_nm ?? g.obs[0]!.torqueNm;
    const shift =
      learned.ok && g.geometry
        ? {
            ...preloadShift(torqueNm, g.geometry, { thread: first.hb_thread, bearing: first.hb_bearing }, learned.friction, g.d),
            torqueNm,
            fromMaker: first.maker_torque_nm !== null,
          }
        : null;
    return { fastenerId: first.fastener_id, fastenerName: first.fastener_name, lubricant: first.lubricant, learned, shift };
  });
}
