import { SpecReport } from "@/components/spec-report";
import { Notice } from "@/components/ui/notice";
import type { VersionView } from "@/db/queries/submissions";
import { UNREADABLE_KEPT_EARLIER } from "@/lib/pieces/versions";

/**
 * Uploads made after the page's file in use that the check could not read, so they did not
 * replace it: each with its report, beside the file that stays in use.
 */
export function UnreadableUploads({
  versions,
  pageIndex,
  inUse,
  when,
}: {
  versions: VersionView[];
  pageIndex: number;
  /** The version still in use. */
  inUse: number;
  when: (iso: string) => string;
}) {
  return (
    <div className="flex flex-col gap-3" data-testid={`unreadable-uploads-${pageIndex}`}>
      {versions.map((v) => (
        <Notice
          key={v.id}
          tone="warn"
          title={`Version ${v.versionNumber}, ${v.fileName}: not used`}
          testId="unreadable-upload"
        >
          <div className="flex flex-col gap-3">
            <p>
              {UNREADABLE_KEPT_EARLIER} Version {inUse} is still the file for this page. Uploaded{" "}
              {when(v.uploadedAt)}; what the check found:
            </p>
            <SpecReport report={v.report} />
          </div>
        </Notice>
      ))}
    </div>
  );
}
