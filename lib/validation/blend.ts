// Input to POST /api/blend: a list of materials to mix, each by mass, with any of its
// composition the caller knows; the rest comes from the facts table.
import { z } from "zod";
import { MATERIAL_CODES, MATERIALS } from "@/lib/calc/facts";

const componentSchema = z
  .object({
    material: z.enum(MATERIAL_CODES, { error: `material must be one of: ${MATERIAL_CODES.join(", ")}` }).optional(),
    mass_kg: z.number().positive("mass must be more than 0 kg").max(1e6, "mass must be at most 1,000,000 kg"),
    moisture_pct: z.number().min(0, "moisture must be at least 0 %").max(99, "moisture must be at most 99 %").optional(),
    n_pct: z.number().positive("nitrogen must be more than 0 %").max(20, "nitrogen must be at most 20 %").optional(),
    cn_ratio: z.number().positive("C:N must be more than 0").max(2000, "C:N must be at most 2000").optional(),
    c_pct: z.number().min(0, "carbon must be at least 0 %").max(100, "carbon must be at most 100 %").optional(),
  })
  .superRefine((c, ctx) => {
    // What the table does not know (no material, or compost's and worms' blanks) the caller must.
    const facts = c.material ? MATERIALS[c.material] : undefined;
    const what = facts ? `no figure on file for ${facts.name.toLowerCase()}` : "needed when no material is named";
    if (c.moisture_pct === undefined && facts?.moisture_pct === undefined) {
      ctx.addIssue({ code: "custom", path: ["moisture_pct"], message: `Give moisture_pct (${what})` });
    }
    if (c.n_pct === undefined && (facts?.n_pct ?? undefined) === undefined) {
      ctx.addIssue({ code: "custom", path: ["n_pct"], message: `Give n_pct (${what})` });
    }
    if (c.cn_ratio === undefined && c.c_pct === undefined && (facts?.cn_ratio ?? undefined) === undefined) {
      ctx.addIssue({ code: "custom", path: ["cn_ratio"], message: `Give cn_ratio or c_pct (${what})` });
    }
  });

export const blendSchema = z.object({
  components: z
    .array(componentSchema)
    .min(1, "add at least one material")
    .max(50, "at most 50 materials in one blend"),
  target_moisture_pct: z.number().min(1, "target moisture must be at least 1 %").max(95, "target moisture must be at most 95 %").optional(),
});

export type BlendInput = z.infer<typeof blendSchema>;
