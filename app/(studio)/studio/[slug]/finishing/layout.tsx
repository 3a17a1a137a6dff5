import { guardedSectionLayout } from "@/server/auth/guard";

export default guardedSectionLayout("finishing:view", "finishing");
