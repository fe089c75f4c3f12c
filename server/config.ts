import { z } from 'zod';
import { DEFAULT_ABSOLUTE_MS, DEFAULT_IDLE_MS } from './auth/session';

const minutes = (ms: number) => Math.round(ms / 60000);

/** Environment variables, parsed once at start-up; a bad value stops the server with a clear message. */
const envSchema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('0.0.0.0'),
  DATABASE_URL: z.string().min(1),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters'),
  COOKIE_SECURE: z.enum(['true', 'false']).default('false'),
  TRUST_PROXY: z.enum(['true', 'false']).default('false'),
  SESSION_IDLE_MINUTES: z.coerce.number().int().positive().default(minutes(DEFAULT_IDLE_MS)),
  SESSION_ABSOLUTE_MINUTES: z.coerce.number().int().positive().default(minutes(DEFAULT_ABSOLUTE_MS)),
  SEED_DEMO: z.enum(['true', 'false']).default('true'),
});

export type Config = z.infer<typeof envSchema>;

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const result = envSchema.safeParse(env);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  return result.data;
}
