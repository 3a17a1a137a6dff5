import type { ReactNode } from "react";
import { ReviewQueryProvider } from "./_components/query-provider";

export default function SubmissionsLayout({ children }: { children: ReactNode }) {
  return <ReviewQueryProvider>{children}</ReviewQueryProvider>;
}
