import { LoadingState } from '@/components/ui/loading-state';

/** Shown in place of a page while its code or the session check is on its way. */
export const PageLoading = () => <LoadingState label="Loading…" />;
