import { z } from 'zod';

const day = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/)
  .refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)));
const optional = <T extends z.ZodType>(schema: T) => schema.optional().catch(undefined);

/** The audit viewer's filters, as they stand in the address; a value that does not parse is ignored. */
export const AuditQuerySchema = z.object({
  person: optional(z.coerce.number().int().positive().max(4_294_967_295)),
  action: optional(
    z
      .string()
      .regex(/^[a-z][a-z_]*\.[a-z_]+$/)
      .max(80),
  ),
  from: optional(day),
  to: optional(day),
  page: z.coerce.number().int().min(1).max(100_000).catch(1).default(1),
});
export type AuditQuery = z.infer<typeof AuditQuerySchema>;

export const AUDIT_PAGE_SIZE = 50;
