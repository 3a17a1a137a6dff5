import { guardedSectionLayout } from "@/server/auth/guard";

export default guardedSectionLayout("stock:view", "stock");
