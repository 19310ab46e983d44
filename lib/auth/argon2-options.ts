// argon2id at OWASP's minimum profile (m = 19 MiB, t = 2, p = 1; common practice). Shared by the app and the seed.
export const ARGON2_OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;
