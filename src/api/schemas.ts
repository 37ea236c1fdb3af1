/**
 * Shapes of the API answers the client reads, checked with zod so a contract
 * drift fails with a message naming the field (see parseAnswer in client.ts).
 * Request bodies the server validates are not repeated here.
 */
import { z } from 'zod';
import { ROLES } from '@/shared/api';

export const userSchema = z.object({
  id: z.union([z.number(), z.string()]),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
});
export type User = z.infer<typeof userSchema>;

export const loginAnswerSchema = z.object({ token: z.string().min(1), user: userSchema });
export type LoginAnswer = z.infer<typeof loginAnswerSchema>;

export const meAnswerSchema = z.object({ user: userSchema });

export const summarySchema = z.object({
  networkVersion: z.union([z.number(), z.string()]),
  counts: z.object({
    sites: z.number(),
    services: z.number(),
    groups: z.number(),
    carriages: z.number(),
    feeds: z.number(),
  }),
  sitesByRole: z.object({ origin: z.number(), main: z.number(), relay: z.number() }),
});
export type NetworkSummary = z.infer<typeof summarySchema>;

export const accountSchema = userSchema.extend({
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type Account = z.infer<typeof accountSchema>;

export const accountsAnswerSchema = z.object({ users: z.array(accountSchema) });
