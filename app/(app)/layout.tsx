import { NavBar } from "@/components/NavBar";
import { SiteFormatProvider } from "@/components/SiteFormat";
import { currentUser, signInFirst } from "@/lib/auth/guard";
import { getSite } from "@/db/sites";
import { DEFAULT_DATE_STYLE } from "@/lib/format/dates";

// The shell knows who is signed in and how their site writes dates; each page checks its own permission.
export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const user = await currentUser();
  if (!user) return signInFirst();
  const site = await getSite(user.siteId);
  return (
    <SiteFormatProvider dateStyle={site?.dateStyle ?? DEFAULT_DATE_STYLE}>
      <NavBar user={user} />
      <main className="mx-auto max-w-6xl px-4 py-6 print:max-w-none print:p-0">{children}</main>
    </SiteFormatProvider>
  );
}
