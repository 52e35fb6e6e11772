import { useLocation } from "react-router";
import { NotBuiltYet } from "~/components/app-shell";

// Assembly, Runs and Files: tabs whose pages come with a later piece of work.
const LATER: Record<string, { title: string; what: string }> = {
  assembly: {
    title: "Assembly",
    what: "This tab will hold the assembly record: which seal plan went on, the torque actually applied at each stage, measured stud stretch, the date, who did it, and photos.",
  },
  runs: {
    title: "Runs",
    what: "This tab will hold the run log: dyno sessions and passes with manifold pressure, fuel, peak cylinder pressure (measured or estimated), whether the seal held, seeped, lifted or blew and on which cylinders, and teardown notes.",
  },
  files: {
    title: "Files",
    what: "This tab will hold the engine's files and photos: build photos, teardown pictures and fastener makers' sheets, kept for this shop only.",
  },
};

export default function Later() {
  const last = useLocation().pathname.replace(/\/+$/, "").split("/").pop() ?? "";
  const page = LATER[last] ?? LATER.files!;
  return (
    <section>
      <h2 className="mb-3 text-2xl font-bold">{page.title}</h2>
      <NotBuiltYet what={page.what} />
    </section>
  );
}
