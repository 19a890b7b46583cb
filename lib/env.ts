import { z } from "zod";

// Read and validated once; a misconfigured process fails at start-up with every problem listed.
const envSchema = z.object({
  DATABASE_URL: z.string().url(),
  REDIS_URL: z.string().url(),
  REDIS_PREFIX: z.string().min(1).default("sagline"),
  APP_URL: z.string().url(),
  NEXTAUTH_SECRET: z.string().min(32, "must be at least 32 characters"),
  SMTP_HOST: z.string().min(1).default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().positive().default(2590),
  MAIL_FROM: z.string().min(3).default("Sagline <no-reply@sagline.local>"),
  SAGLINE_FAKES: z.enum(["0", "1"]).default("0"),
  MAIL_UI_URL: z.string().url().optional(),
  SIGN_IN_MAX_FAILURES: z.coerce.number().int().positive().default(5),
  SIGN_IN_LOCK_MINUTES: z.coerce.number().int().positive().default(15),
  /** Sign-in attempts per client address per SIGN_IN_LOCK_MINUTES window, over every account. */
  SIGN_IN_MAX_PER_ADDRESS: z.coerce.number().int().positive().default(50),
  /** Proxies in front of the web process that append to X-Forwarded-For (0: none, development). */
  TRUSTED_PROXY_COUNT: z.coerce.number().int().min(0).max(10).default(0),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function getEnv(): Env {
  if (cached) return cached;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join("\n")}`);
  }
  cached = parsed.data;
  return cached;
}
