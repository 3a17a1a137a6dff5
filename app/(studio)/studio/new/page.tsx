import { requireUser } from "@/server/auth/guard";
import { AnthologyForm } from "./_components/anthology-form";

export const metadata = { title: "New anthology" };

export default async function NewAnthologyPage() {
  await requireUser("/studio/new");
  return (
    <div className="flex max-w-4xl flex-col gap-6">
      <div>
        <h1 className="text-3xl font-extrabold">New anthology</h1>
        <p className="text-ink-soft">
          The spec you set here is what every contributor&apos;s file is checked against. You can
          change it later.
        </p>
      </div>
      <AnthologyForm />
    </div>
  );
}
