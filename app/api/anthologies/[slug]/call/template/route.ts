import { z } from "zod";
import { findAnthologyBySlug } from "@/db/queries/anthologies";
import { findCall } from "@/db/queries/open-call";
import { apiRoute, currentUserMay, HttpError, readQuery } from "@/server/api";
import { colourModeText } from "@/lib/call-spec";
import { findPreset } from "@/lib/print/sizes";
import { specOf } from "@/lib/print/spec";
import { callPhase } from "@/lib/stages";
import {
  renderTemplatePdf,
  renderTemplatePng,
  TEMPLATE_FORMATS,
  templateFileName,
  type TemplateSpec,
} from "@/lib/templates";

const templateQuerySchema = z.object({
  format: z.enum(TEMPLATE_FORMATS, { error: "Ask for format=png or format=pdf." }).default("png"),
});

/**
 * A page template at trim plus bleed (?format=png|pdf). Anyone may download it once the call is
 * published; before that, only the anthology's members.
 */
export const GET = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { format } = readQuery(request, templateQuerySchema);
  const anthology = await findAnthologyBySlug(slug);
  const notHere = new HttpError(404, `No published open call called "${slug}".`);
  if (!anthology) throw notHere;
  const call = await findCall(anthology.id);
  const published =
    callPhase(call?.publishedAt ? call : null, anthology.stage, new Date()) !== "unpublished";
  if (!published && !(await currentUserMay(anthology.id, "anthology:view"))) throw notHere;
  const printSpec = specOf(anthology, { inks: call?.allowedInks });
  const spec: TemplateSpec = {
    ...printSpec,
    title: anthology.title,
    colourMode: colourModeText(printSpec.printMethod, printSpec.inks),
    inchesFirst: Boolean(findPreset(anthology.trimPreset)?.inches),
  };
  const bytes = format === "png" ? await renderTemplatePng(spec) : await renderTemplatePdf(spec);
  return new Response(new Uint8Array(bytes), {
    headers: {
      "content-type": format === "png" ? "image/png" : "application/pdf",
      "content-disposition": `attachment; filename="${templateFileName(anthology.slug, spec, format)}"`,
      "content-length": String(bytes.byteLength),
      "cache-control": "no-cache",
    },
  });
});
