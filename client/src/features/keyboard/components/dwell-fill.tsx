/**
 * The visible dwell progress on a target: a fill over the whole key, rising from the bottom edge to
 * the top as the dwell runs. The fill is white drawn in "difference" blending, so the part of the key
 * it covers shows in inverted colours (dark keys turn light, light keys dark, the label inverted with
 * them): the edge between filled and unfilled stays in strong contrast in both themes and the label
 * stays readable. With reduced motion the fill grows in quarter steps; it never animates by itself
 * (the height follows the dwell timer).
 */
export const DwellFill = ({ progress, reduceMotion }: { progress: number; reduceMotion: boolean }) => {
  const shown = reduceMotion ? Math.floor(progress * 4) / 4 : progress;
  return (
    <span
      aria-hidden="true"
      data-dwell-fill={shown.toFixed(2)}
      className="pointer-events-none absolute inset-x-0 bottom-0 z-10"
      style={{
        height: `${Math.round(Math.min(1, Math.max(0, shown)) * 100)}%`,
        backgroundColor: '#ffffff',
        mixBlendMode: 'difference',
      }}
    />
  );
};
