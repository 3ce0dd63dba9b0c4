/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    user: import("./lib/auth/roles").CurrentUser | null;
    /** Why a session was not accepted (e.g. "deactivated"), for the sign-in page. */
    signedOutReason?: "deactivated" | undefined;
    requestId: string;
  }
}
