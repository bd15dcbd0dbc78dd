import { Spinner } from "@/components/ui/empty-state";

export default function Loading() {
  return (
    <div className="py-10">
      <Spinner />
    </div>
  );
}
