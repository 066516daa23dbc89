import { Logo } from '@/components/layout/Logo';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="from-granite-50 via-paper to-paper flex flex-1 flex-col bg-linear-to-b">
      <header className="max-w-shell px-gutter mx-auto w-full py-4">
        <Logo />
      </header>
      <main id="main" className="px-gutter flex flex-1 items-start justify-center pt-4 pb-16 sm:pt-10">
        {children}
      </main>
    </div>
  );
}
