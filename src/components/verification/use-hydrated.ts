// True once the island has hydrated: buttons that need JavaScript stay disabled until then, so a
// click during page load cannot fall through to a native form submission and lose the form.
import { useEffect, useState } from "react";

export function useHydrated(): boolean {
  const [isHydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);
  return isHydrated;
}
