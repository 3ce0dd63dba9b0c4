// Auth.js configuration: e-mail + password (Credentials), JWT sessions carrying the user id and role.
import Credentials from "@auth/core/providers/credentials";
import { defineConfig } from "auth-astro";
import { checkCredentials } from "./src/server/auth/sign-in";

export default defineConfig({
  // Read at run time from the process, never through import.meta.env (that would bake it into the build).
  secret: process.env.AUTH_SECRET,
  trustHost: true,
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  pages: { signIn: "/sign-in", error: "/sign-in" },
  providers: [
    Credentials({
      credentials: { email: { label: "E-mail" }, password: { label: "Password", type: "password" } },
      authorize: async (credentials) => checkCredentials(credentials),
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.sub = String(user.id);
        token.role = (user as { role?: string }).role;
      }
      return token;
    },
    session({ session, token }) {
      const u = session.user as unknown as Record<string, unknown>;
      u.id = token.sub;
      u.role = token.role;
      return session;
    },
  },
});
