import { Skeleton, TableSkeleton } from '@/components/ui/skeleton';

export default function RosterLoading() {
  return (
    <div className="space-y-6">
      <Skeleton className="h-8 w-40" />
      <TableSkeleton rows={6} />
    </div>
  );
}
