import { z } from 'zod';

const flag = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no', ''])
  .optional()
  .transform((v) => v === '1' || v === 'true' || v === 'yes');

/** Every setting the server reads. Parsed once; nothing else reads process.env. */
export const settingsSchema = z
  .object({
    HOST: z.string().min(1).default('127.0.0.1'),
    PORT: z.coerce.number().int().min(1).max(65535).default(4321),
    WAKEBOOK_DB: z.string().min(1).default('data/wakebook.db'),
    WAKEBOOK_UPLOADS: z.string().min(1).default('data/uploads'),
    WAKEBOOK_DEMO: flag,
    SMTP_URL: z
      .string()
      .optional()
      .transform((v) => (v ? v : undefined))
      .refine((v) => v === undefined || /^smtps?:\/\//.test(v), 'must start with smtp:// or smtps://'),
    PUBLIC_URL: z
      .string()
      .optional()
      .transform((v) => (v ? v.replace(/\/+$/, '') : undefined))
      .refine((v) => v === undefined || /^https?:\/\/[^\s]+$/.test(v), 'must be an http(s) URL'),
    /** Secure cookies are the default in production; set to 0 to serve plain http on a LAN host. */
    WAKEBOOK_SECURE_COOKIES: z
      .enum(['1', '0', 'auto', ''])
      .optional()
      .transform((v) => (v === '1' ? true : v === '0' ? false : ('auto' as const))),
    /** The sender of Wakebook's e-mail; defaults to an address at PUBLIC_URL's host. */
    MAIL_FROM: z
      .string()
      .optional()
      .transform((v) => (v ? v.trim() : undefined))
      .refine(
        (v) => v === undefined || (/^[^\r\n]{3,200}$/.test(v) && /@/.test(v)),
        'must be an address like "Wakebook <team@example.org>"',
      ),
    /** A shared secret that lets a scheduler call POST /api/digest/send over loopback (`npm run digest`). */
    WAKEBOOK_CRON_TOKEN: z
      .string()
      .optional()
      .transform((v) => (v ? v : undefined))
      .refine((v) => v === undefined || v.length >= 32, 'must be at least 32 characters (e.g. `openssl rand -hex 32`)'),
    /** Behind a reverse proxy that sets X-Forwarded-For: trust it for the client's address (throttling, audit). */
    WAKEBOOK_TRUST_PROXY: flag,
    /** The team's name, printed at the top of every printout (the demo uses its own team's name). */
    WAKEBOOK_TEAM_NAME: z
      .string()
      .optional()
      .transform((v) => (v ? v.trim() : undefined))
      .refine(
        (v) => v === undefined || /^[^\u0000-\u001f]{1,120}$/.test(v),
        'must be one line of at most 120 characters',
      ),
    WAKEBOOK_MAX_UPLOAD_MB: z.coerce.number().positive().max(1024).default(20),
    /** Importing documents (/api/imports): files in one import, counting each file inside a zip. */
    WAKEBOOK_IMPORT_MAX_FILES: z.coerce.number().int().min(1).max(10_000).default(500),
    /** Importing: the largest .zip accepted (each file in it, and every other file, is held to WAKEBOOK_MAX_UPLOAD_MB). */
    WAKEBOOK_IMPORT_ZIP_MB: z.coerce.number().positive().max(4096).default(200),
    /** Importing: what the files of one import may add up to once unzipped (also the largest request). */
    WAKEBOOK_IMPORT_TOTAL_MB: z.coerce.number().positive().max(8192).default(500),
    /** Memory for rendered signed-in reads kept until the next write (0 turns the cache off). */
    WAKEBOOK_RESPONSE_CACHE_MB: z.coerce.number().min(0).max(1024).default(24),
    /** Serve https directly: both PEM files must be given together (the start file reads them). */
    SERVER_CERT_PATH: z
      .string()
      .optional()
      .transform((v) => (v ? v : undefined)),
    SERVER_KEY_PATH: z
      .string()
      .optional()
      .transform((v) => (v ? v : undefined)),
    NODE_ENV: z.string().optional(),
  })
  .refine((s) => !s.SERVER_CERT_PATH === !s.SERVER_KEY_PATH, {
    path: ['SERVER_KEY_PATH'],
    message: 'SERVER_CERT_PATH and SERVER_KEY_PATH go together: set both or neither',
  });

export type Settings = z.infer<typeof settingsSchema>;

export class SettingsError extends Error {}

export function parseSettings(env: Record<string, string | undefined>): Settings {
  const result = settingsSchema.safeParse(env);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new SettingsError(`Wakebook cannot start: invalid settings\n${lines.join('\n')}`);
  }
  return result.data;
}

let cached: Settings | undefined;

export function settings(): Settings {
  cached ??= parseSettings(process.env);
  return cached;
}

/** Tests point the server at a fresh database; production never calls this. */
export function resetSettingsForTests(): void {
  cached = undefined;
}
