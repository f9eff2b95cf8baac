import { z } from "zod";
import "./zod-config";

/** `GET /api/me/export?format=csv|json`: the format must be named; anything else is 422. */
export const myExportQuerySchema = z.object({
  format: z.enum(["csv", "json"], { message: "Choose format=csv or format=json." }),
});
export type MyExportQuery = z.infer<typeof myExportQuerySchema>;
