export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center px-4 py-12">
      <div className="w-full max-w-sm">
        <div className="mb-8 text-center">
          <p className="text-3xl font-bold tracking-tight">Changewise</p>
          <p className="mt-1 text-sm text-ink-soft">Real change, measured against the test&apos;s own noise.</p>
        </div>
        {children}
      </div>
    </main>
  );
}
