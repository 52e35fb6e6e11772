import { FileList, Uploader } from "./uploader";

// The maker's sheets kept on a fastener or gasket (the library item page): the list for every member of
// the shop, the uploader and the take-away buttons for builders and owners.
export function ItemFiles({
  kind,
  itemId,
  files,
  canEdit,
}: {
  kind: "fasteners" | "gaskets";
  itemId: number;
  files: { id: number; name: string; contentType: string; sizeBytes: number; hasThumb: boolean }[];
  canEdit: boolean;
}) {
  const here = `/libraries/${kind}/${itemId}`;
  const maker = kind === "fasteners" ? "fastener" : "gasket";
  return (
    <section aria-labelledby="item-files-heading" className="mt-8 border-t border-forge-100 pt-4" data-testid="item-files">
      <h3 id="item-files-heading" className="text-lg font-bold">
        The {maker} maker's sheets ({files.length})
      </h3>
      <p className="text-sm text-forge-700">
        The maker's data sheet or instructions, kept with this {maker} for the shop. Where it gives a torque, lubricant or procedure, the
        sheet governs over our estimate.
      </p>
      {files.length ? (
        <FileList files={files} returnTo={canEdit ? here : undefined} />
      ) : (
        <p className="mt-2 text-sm text-forge-700">No sheets kept yet.</p>
      )}
      {canEdit ? <Uploader action={`${here}/files/upload`} returnTo={here} label="Add the maker's sheet (PDF) or a photo of it" /> : null}
    </section>
  );
}
