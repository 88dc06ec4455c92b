/** A quiet "loading" line in a status region (no spinner motion to respect reduced motion). */
export const LoadingState = ({ label }: { label: string }) => (
  <p role="status" className="py-8 text-lg text-ink-soft">
    {label}
  </p>
);
