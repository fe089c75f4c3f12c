import * as z from '@shared/zod';
import { DEFAULT_ABSOLUTE_MS, DEFAULT_IDLE_MS } from './auth/session';

const minutes = (ms: number) => Math.round(ms / 60000);

/** Environment variables, parsed once at start-up; a bad value stops the server with a clear message. */
const envSchema = z.object({
  PORT: z._default(z.coerce.number().check(z.int(), z.gte(0), z.lte(65535)), 3000),
  HOST: z._default(z.string(), '0.0.0.0'),
  DATABASE_URL: z.string().check(z.minLength(1)),
  SESSION_SECRET: z.string().check(z.minLength(32, 'SESSION_SECRET must be at least 32 characters')),
  COOKIE_SECURE: z._default(z.enum(['true', 'false']), 'false'),
  TRUST_PROXY: z._default(z.enum(['true', 'false']), 'false'),
  SESSION_IDLE_MINUTES: z._default(z.coerce.number().check(z.int(), z.positive()), minutes(DEFAULT_IDLE_MS)),
  SESSION_ABSOLUTE_MINUTES: z._default(z.coerce.number().check(z.int(), z.positive()), minutes(DEFAULT_ABSOLUTE_MS)),
  SEED_DEMO: z._default(z.enum(['true', 'false']), 'true'),
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
