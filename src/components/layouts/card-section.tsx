import type { ReactNode } from 'react';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { SectionCard } from '@/components/ui/section-card';

/** A titled card on a page whose failure stays inside it, with "Try again", while the rest of the page works on. */
export function CardSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <SectionBoundary title={title}>
      <SectionCard title={title}>{children}</SectionCard>
    </SectionBoundary>
  );
}
