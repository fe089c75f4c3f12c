import { SectionBoundary } from '@/components/errors/section-boundary';
import { useMe } from '@/features/auth/api/get-me';
import { CarList } from '@/features/cars/components/car-list';

export function CarsPage() {
  const { data: user } = useMe();
  if (!user) return null;
  return (
    <div className="flex flex-col gap-6">
      <title>Cars · Scrubline</title>
      <h1 className="text-3xl font-extrabold">Cars</h1>
      <SectionBoundary title="Your cars">
        <CarList currentUserId={user.id} />
      </SectionBoundary>
    </div>
  );
}
