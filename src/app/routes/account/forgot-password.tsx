import { PageMessage } from '@/components/ui/page-message';

/** Placeholder until the page is built. */
export function ForgotPasswordPage() {
  return <PageMessage title="Coming soon"><p>This page is on its way.</p></PageMessage>;
}
