import { z } from "zod";

// In the browser zod would probe once whether it may compile its parsers with `new Function`. Our
// Content-Security-Policy has no 'unsafe-eval', so the probe is refused and reported as a policy
// violation (zod catches the error, but the report stays in the console). Forms parse small inputs:
// the plain parsers are fast enough there, and the server keeps the compiled ones.
if (typeof window !== "undefined") z.config({ jitless: true });
