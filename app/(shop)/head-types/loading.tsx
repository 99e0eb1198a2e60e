// Loading skeletons sit in the page segments, not on the whole (shop) group: a group-level
// Suspense boundary would flush a 200 before a page can answer forbidden() with a real 403.
import { PageSkeleton } from "@/components/ui/PageSkeleton";

export default PageSkeleton;
