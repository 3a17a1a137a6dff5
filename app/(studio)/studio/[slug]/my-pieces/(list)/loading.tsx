import { LoadingCards } from "@/components/ui/loading-cards";

/** Shown while the list of a contributor's pieces loads. */
export default function Loading() {
  return <LoadingCards message="Loading your pieces…" testId="my-pieces-loading" />;
}
