import Link from "next/link";
import { headers } from "next/headers";
import { findAnthologyBySlug, findRole } from "@/db/queries/anthologies";
import { findCall } from "@/db/queries/open-call";
import { currentUser } from "@/server/auth/guard";
import { anthologySlugOfPath, forbiddenReason, STUDIO_PATH_HEADER } from "@/lib/auth/forbidden";
import { callPhase } from "@/lib/stages";

async function reasonForThisRequest() {
  const slug = anthologySlugOfPath((await headers()).get(STUDIO_PATH_HEADER));
  const user = await currentUser();
  const anthology = slug ? await findAnthologyBySlug(slug) : undefined;
  if (!user || !anthology) return forbiddenReason(null, true, false);
  const role = await findRole(anthology.id, user.id);
  const call = role ? undefined : await findCall(anthology.id);
  const open = call ? callPhase(call, anthology.stage, new Date()) === "open" : false;
  return forbiddenReason(anthology, role !== null, open);
}

export default async function Forbidden() {
  const reason = await reasonForThisRequest();
  return (
    <section className="mx-auto max-w-xl py-16 text-center" data-testid="forbidden">
      <p className="font-mono text-sm text-persimmon-dark">403</p>
      {reason.kind === "outsider" ? (
        <>
          <h1 className="mt-2 text-3xl font-extrabold">You are not a member of this anthology</h1>
          <p className="mt-4 text-ink-soft" data-testid="forbidden-outsider">
            You are signed in, but you have no part in {reason.anthologyTitle} yet.{" "}
            {reason.openCallPath ? (
              <>
                To join, <Link href={reason.openCallPath}>answer its open call</Link> or ask one of
                its editors for an invitation.
              </>
            ) : (
              <>To join, ask one of its editors for an invitation.</>
            )}
          </p>
        </>
      ) : (
        <>
          <h1 className="mt-2 text-3xl font-extrabold">This page is for another role</h1>
          <p className="mt-4 text-ink-soft">
            You are signed in, but your role in this anthology does not open this page. If you think
            it should, ask the anthology&apos;s lead editor to change your role.
          </p>
        </>
      )}
      <Link href="/studio" className="mt-6 inline-block font-semibold">
        Back to your anthologies
      </Link>
    </section>
  );
}
