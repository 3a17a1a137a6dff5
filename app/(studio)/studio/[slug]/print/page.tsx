import { requireAnthologyAccess } from "@/server/auth/guard";
import { printFilesView } from "@/server/print/service";
import { PrintScreen } from "./_components/print-screen";

export const metadata = { title: "Print files" };

export default async function PrintFilesPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, role } = await requireAnthologyAccess(
    slug,
    "print:view",
    `/studio/${slug}/print`,
  );
  const initial = await printFilesView(anthology, role);
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-3xl font-extrabold">Print files</h1>
        <p className="max-w-3xl text-sm text-ink-soft">
          The imposed print file and a reader proof of {anthology.title}, made from the page map and
          every page&rsquo;s current file. Check the list below first: anything marked &ldquo;must
          fix&rdquo; stops the files being made.
        </p>
      </div>
      <PrintScreen slug={slug} initial={initial} />
    </div>
  );
}
