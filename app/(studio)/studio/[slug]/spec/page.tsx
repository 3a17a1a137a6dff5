import { Notice } from "@/components/ui/notice";
import { anthologySpecOf, countCurrentFiles, countPlacedPages } from "@/db/queries/spec-edit";
import { BINDING_LABELS, PRINT_METHOD_LABELS } from "@/lib/domain";
import { formatLength, formatTrim } from "@/lib/format";
import { specInputFromAnthology } from "@/lib/validations/spec-edit";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { SpecForm } from "./_components/spec-form";

export const metadata = { title: "Print spec" };

/** The anthology's print spec, and the form that changes it after the call has started. */
export default async function SpecPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology } = await requireAnthologyAccess(
    slug,
    "anthology:edit-spec",
    `/studio/${slug}/spec`,
  );
  const [files, placed] = await Promise.all([
    countCurrentFiles(anthology.id),
    countPlacedPages(anthology.id),
  ]);
  return (
    <div className="flex flex-col gap-8">
      <div>
        <h1 className="text-3xl font-extrabold">Print spec</h1>
        <p className="mt-1 max-w-3xl text-ink-soft">
          What every page of {anthology.title} is made to. A change is weighed against the page map
          and the files already sent before it is saved: what would break is refused, what would
          cost someone work asks you to confirm, and once saved every current file is checked again
          against the new spec.
        </p>
      </div>
      <Notice tone="caution" title="As it stands" testId="spec-now">
        {formatTrim(anthology)}, {formatLength(anthology.bleedMm)} bleed,{" "}
        {formatLength(anthology.safeMarginMm)} safe margin, at least {anthology.minPpi} ppi;{" "}
        {BINDING_LABELS[anthology.binding].toLowerCase()}, {anthology.pageCountTarget} pages (at
        most {anthology.maxPages}); {PRINT_METHOD_LABELS[anthology.printMethod].toLowerCase()} in{" "}
        {anthology.inks.join(", ")}. {files} current file{files === 1 ? "" : "s"} sent; {placed}{" "}
        page{placed === 1 ? "" : "s"} of the map hold{placed === 1 ? "s" : ""} a piece.
      </Notice>
      <SpecForm
        slug={anthology.slug}
        initial={specInputFromAnthology(anthologySpecOf(anthology))}
      />
    </div>
  );
}
