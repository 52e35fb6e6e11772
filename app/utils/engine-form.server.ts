// One post of the engine form, shared by the new and edit pages: save, regenerate the stud pattern,
// or one of Conform's list intents (add or remove a stud), all of which work without JavaScript.
import { data } from "react-router";
import { engineFormSchema, generateStudRows, type EngineInput } from "~/lib/engine";
import type { UnitSystem } from "~/lib/units";
import type { EngineInputError } from "~/models/engine.server";
import { parseSubmission, readIntent } from "./conform.server";

type EngineSubmission = ReturnType<typeof parseSubmission<ReturnType<typeof engineFormSchema>>>;

export type EngineFormStep =
  | { answer: ReturnType<typeof answer>; engine?: undefined; submission?: undefined }
  | { answer?: undefined; engine: EngineInput; submission: EngineSubmission };

const answer = (submission: EngineSubmission, status = 200, options: Parameters<EngineSubmission["reply"]>[0] = {}) =>
  data({ result: submission.reply(options) }, { status });

/** The form posted back with Conform's update intent in place of the route's own button word. */
function withIntent(formData: FormData, intent: object): FormData {
  const out = new FormData();
  for (const [k, v] of formData) if (k !== "intent" && k !== "__intent__") out.append(k, v);
  out.set("__intent__", JSON.stringify(intent));
  return out;
}

const text = (v: FormDataEntryValue | null) => (typeof v === "string" ? v : undefined);

/**
 * What a post of the engine form asks for. "pattern" answers with the default studs for the posted
 * layout as a Conform update of the list (or a message beside "Studs per side"), a list intent with
 * the changed rows; a save either gives the SI engine input or answers 400 with every message.
 */
export async function engineFormStep(
  formData: FormData,
  units: UnitSystem,
  allowed: readonly ("save" | "pattern" | "archive")[],
): Promise<EngineFormStep> {
  const schema = engineFormSchema(units);
  if (readIntent(formData, allowed, "save") === "pattern") {
    const r = generateStudRows(text(formData.get("layout")), text(formData.get("cylinders")), text(formData.get("studsPerSide")));
    if ("error" in r) {
      const submission = parseSubmission(
        withIntent(formData, { type: "update", payload: { name: "studsPerSide", validated: true } }),
        schema,
      );
      return { answer: answer(submission, 200, { fieldErrors: { studsPerSide: [r.error] } }) };
    }
    return { answer: answer(parseSubmission(withIntent(formData, { type: "update", payload: { name: "studs", value: r.rows } }), schema)) };
  }
  const submission = parseSubmission(formData, schema);
  if (submission.status === "success") return { engine: submission.value, submission };
  return { answer: answer(submission, submission.status === "error" ? 400 : 200) };
}

/** The model refused the input (another shop's material): 400 with its messages beside the fields. */
export function refuseEngine(submission: EngineSubmission, error: EngineInputError) {
  const fieldErrors = Object.fromEntries(Object.entries(error.errors).map(([name, message]) => [name, [message]]));
  return answer(submission, 400, { fieldErrors });
}
