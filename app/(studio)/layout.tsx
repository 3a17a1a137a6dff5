import type { ReactNode } from "react";
import { QueryProvider } from "@/components/query-provider";

/** Every signed-in screen shares one query cache, so moving between them keeps what was loaded. */
export default function StudioLayout({ children }: { children: ReactNode }) {
  return <QueryProvider>{children}</QueryProvider>;
}
