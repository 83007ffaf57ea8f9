import { SkeletonText } from "@/components/ui";

export default function Loading() {
  return (
    <div aria-busy="true" aria-label="Loading" className="flex flex-col gap-4 py-4">
      <SkeletonText lines={6} />
    </div>
  );
}
