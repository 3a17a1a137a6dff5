import { guardedSectionLayout } from "@/server/auth/guard";

export default guardedSectionLayout("map:view", "map");
