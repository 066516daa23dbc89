import { Audiences } from './_components/Audiences';
import { Hero } from './_components/Hero';
import { Steps } from './_components/Steps';
import { SafetyNotice } from '@/components/ui/SafetyNotice';
import { currentActor } from '@/lib/auth/current';

export default async function LandingPage() {
  const signedIn = Boolean(await currentActor());
  return (
    <>
      <Hero signedIn={signedIn} />
      <Steps />
      <Audiences />
      <section className="max-w-shell px-gutter mx-auto py-12">
        <SafetyNotice className="max-w-measure mx-auto" />
      </section>
    </>
  );
}
