import { NavBar } from "@/components/NavBar";
import { currentUser, signInFirst } from "@/lib/auth/guard";

// The shell only needs to know who is signed in; each page checks its own permission.
export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const user = await currentUser();
  if (!user) return signInFirst();
  return (
    <>
      <NavBar user={user} />
      <main className="mx-auto max-w-6xl px-4 py-6 print:max-w-none print:p-0">{children}</main>
    </>
  );
}
