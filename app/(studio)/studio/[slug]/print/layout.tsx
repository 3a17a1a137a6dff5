import { guardedSectionLayout } from "@/server/auth/guard";

export default guardedSectionLayout("print:view", "print");
