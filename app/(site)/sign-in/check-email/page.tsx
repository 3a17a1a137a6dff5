export const metadata = { title: "Check your e-mail" };

export default async function CheckEmail({
  searchParams,
}: {
  searchParams: Promise<{ email?: string }>;
}) {
  const { email } = await searchParams;
  return (
    <section className="mx-auto max-w-xl py-10" data-testid="check-email">
      <h1 className="text-3xl font-extrabold">Check your e-mail</h1>
      <p className="mt-4 text-ink-soft">
        We sent a sign-in link
        {email ? (
          <>
            {" "}
            to <strong>{email}</strong>
          </>
        ) : null}
        . It works once and expires in an hour. You can close this tab.
      </p>
    </section>
  );
}
