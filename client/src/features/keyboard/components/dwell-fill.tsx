/**
 * The visible dwell progress on a target: a bar along its bottom edge. With reduced motion the bar
 * grows in quarter steps; it never animates by itself (the width follows the dwell timer).
 */
export const DwellFill = ({
  progress,
  reduceMotion,
  highContrast,
}: {
  progress: number;
  reduceMotion: boolean;
  highContrast: boolean;
}) => {
  const shown = reduceMotion ? Math.floor(progress * 4) / 4 : progress;
  return (
    <span
      aria-hidden="true"
      data-dwell-fill={shown.toFixed(2)}
      className="pointer-events-none absolute inset-x-0 bottom-0 h-2.5"
      style={{
        width: `${Math.round(Math.min(1, Math.max(0, shown)) * 100)}%`,
        backgroundColor: highContrast ? '#ffff00' : '#8a4300',
      }}
    />
  );
};
