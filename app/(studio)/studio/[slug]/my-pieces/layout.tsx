import { guardedSectionLayout } from "@/server/auth/guard";

export default guardedSectionLayout("pieces:view-own", "my-pieces");
