export function SignInRoute() {
  return (
    <section className="max-w-md">
      <h1 className="text-2xl font-semibold tracking-tight">Sign in</h1>
      <p className="mt-3 text-sm text-ink/80">Accounts and teams are on their way; this page will hold the sign-in form.</p>
    </section>
  );
}
