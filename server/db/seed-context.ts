/** What the later parts of the demo seed (catalogue, orders) need from the accounts and shops made first (seed.ts). */
export type SeedContext = { userIds: Record<string, string>; shopIds: Record<string, string> };
