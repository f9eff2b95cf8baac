/** Types of the local mail fake (scripts/mail-fake.mjs), for the tests that start one. */
export function startMailFake(options: {
  port?: number;
  dir: string;
}): Promise<{ port: number; close: () => Promise<void> }>;
