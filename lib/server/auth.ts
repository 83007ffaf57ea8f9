import bcrypt from "bcryptjs";
import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { clearHits, hit, retryAfterMs } from "@/db/rate-limit";
import { users } from "@/db/schema";
import { activeMemberships, findUserByEmail } from "@/db/users";
import { env } from "@/lib/env";
import type { SessionClaims } from "./session-cookie";
import { SIGN_IN_LIMITS, clientKey } from "./sign-in-limits";

/** Told to the sign-in form so it can say why, without hinting whether the e-mail exists. */
export class SignInRateLimited extends CredentialsSignin {
  code = "rate_limited";
}

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email(),
  password: z.string().min(1).max(200),
});

// A real hash of a random password, so an unknown e-mail costs the same time as a wrong password.
const DUMMY_HASH = bcrypt.hashSync("rigline-timing-equaliser", 10);

export type { SessionClaims };

// Lazy config: the environment is read when the first request arrives, not at build time.
export const { handlers, auth, signIn, signOut } = NextAuth(() => ({
  secret: env().AUTH_SECRET,
  trustHost: true,
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  pages: { signIn: "/sign-in" },
  logger: {
    // A wrong password is an expected outcome, not a server error worth a stack trace.
    error(error: Error) {
      if (error.name === "CredentialsSignin" || error.name === "SignInRateLimited") return;
      console.error("[auth]", error);
    },
  },
  providers: [
    Credentials({
      credentials: { email: {}, password: {} },
      async authorize(raw, request) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const database = db();
        const emailKey = `sign-in:email:${email}`;
        const ipKey = `sign-in:client:${clientKey(request)}`;
        const waits = await Promise.all([
          retryAfterMs(database, emailKey, SIGN_IN_LIMITS.perEmail),
          retryAfterMs(database, ipKey, SIGN_IN_LIMITS.perClient),
        ]);
        if (waits.some((ms) => ms > 0)) throw new SignInRateLimited();

        const user = await findUserByEmail(database, email);
        const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
        const membership = user && ok ? (await activeMemberships(database, user.id))[0] : undefined;
        if (!user || !ok || !membership) {
          await hit(database, emailKey, SIGN_IN_LIMITS.perEmail);
          await hit(database, ipKey, SIGN_IN_LIMITS.perClient);
          return null;
        }
        await clearHits(database, emailKey);
        await database.update(users).set({ lastSignInAt: new Date() }).where(eq(users.id, user.id));
        return {
          id: user.id,
          email: user.email,
          name: user.name,
          orgId: membership.orgId,
          role: membership.role,
          sv: user.sessionVersion,
        };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        const u = user as typeof user & { orgId: string; role: string; sv: number };
        token.sub = u.id;
        token.orgId = u.orgId;
        token.role = u.role;
        token.sv = u.sv;
      }
      return token;
    },
    session({ session, token }) {
      const claims: SessionClaims = {
        id: String(token.sub),
        orgId: String(token.orgId),
        role: String(token.role),
        sv: Number(token.sv),
      };
      Object.assign(session.user, claims);
      return session;
    },
  },
}));
