import { apiRoute, readJson, requireApiUser } from "@/server/api";
import { createAnthology, listMyAnthologies } from "@/db/queries/anthologies";
import { anthologyInputSchema, anthologySpecFromInput, slugify } from "@/lib/validations/anthology";
import type { AnthologyCreatedAnswer } from "@/lib/wire/anthologies";

/** The signed-in person's anthologies with their role in each. */
export const GET = apiRoute(async () => {
  const user = await requireApiUser();
  return Response.json({ anthologies: await listMyAnthologies(user.id) });
});

/** Creates an anthology; the creator becomes its lead editor. */
export const POST = apiRoute(async (request) => {
  const user = await requireApiUser();
  const input = await readJson(request, anthologyInputSchema);
  const anthology = await createAnthology(
    user.id,
    {
      title: input.title,
      pressName: input.pressName || null,
      summary: input.summary || null,
      currency: input.currency,
      ...anthologySpecFromInput(input),
    },
    slugify(input.title),
  );
  return Response.json(
    {
      anthology: { id: anthology.id, slug: anthology.slug, title: anthology.title },
    } satisfies AnthologyCreatedAnswer,
    { status: 201 },
  );
});
