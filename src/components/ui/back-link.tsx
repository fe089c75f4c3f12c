import type { ReactNode } from 'react';
import { Link, type To } from 'react-router-dom';
import { ArrowLeft } from 'lucide-react';
import { cn } from '@/lib/cn';

/**
 * The way back above a page's heading: an arrow and where it leads. The name may be one a person typed, so it breaks
 * anywhere it must rather than widening the page.
 */
export function BackLink({ to, className, children }: { to: To; className?: string; children: ReactNode }) {
  return (
    <Link to={to} className={cn('inline-flex min-h-tap items-center gap-1 self-start font-semibold text-link wrap-anywhere', className)}>
      <ArrowLeft aria-hidden="true" className="size-4" /> {children}
    </Link>
  );
}
