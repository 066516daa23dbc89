import { VerdictNotFound } from '@/components/verdict-page/VerdictNotFound';

// /v/[slug]/versions… of a verdict that does not exist or is not this reader's.
export default function NotFound() {
  return <VerdictNotFound />;
}
