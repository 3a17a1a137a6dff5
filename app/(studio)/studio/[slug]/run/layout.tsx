import { guardedSectionLayout } from "@/server/auth/guard";

export default guardedSectionLayout("run:view", "run");
