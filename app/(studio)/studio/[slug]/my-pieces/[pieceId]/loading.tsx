import { LoadingCards } from "@/components/ui/loading-cards";

/** Shown while one piece's pages, reports and versions load. */
export default function Loading() {
  return <LoadingCards message="Loading your piece…" testId="my-piece-loading" tall />;
}
