import { resolve } from 'node:path';
import { z } from 'zod';

/**
 * Every setting the server reads from the environment, parsed once at boot. A wrong value stops the
 * server with a list of what is wrong rather than failing later. `.env.example` documents the same list.
 */
const envSchema = z.object({
  /** Port for the app and API. */
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  /** Folder holding kcatalog.sqlite, attachments and the generated session secret. */
  KCATALOG_DATA_DIR: z.string().min(1).default('./data'),
  /** `demo` seeds the demo accounts and campaign into an empty database; `none` starts empty. */
  KCATALOG_SEED: z.enum(['demo', 'none']).default('demo'),
  /** Secret that signs session cookies; generated once into the data folder when unset. */
  KCATALOG_SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  /** Express "trust proxy" setting: set it (e.g. `1` or `loopback`) behind a TLS-terminating proxy so cookies are marked secure. */
  KCATALOG_TRUST_PROXY: z.string().optional(),
  /** Address the server binds to. */
  KCATALOG_HOST: z.string().default('0.0.0.0'),
});

export type Env = z.infer<typeof envSchema> & { dataDir: string };

/** Parses the environment, or throws an error listing every bad variable. */
export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const result = envSchema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  return { ...result.data, dataDir: resolve(result.data.KCATALOG_DATA_DIR) };
}
