// The SVG of a robot view, named by its title and described by its desc for
// assistive technology.
import { useId, type ReactNode } from "react";

export function ViewPicture({
  width,
  height,
  className,
  label,
  description,
  children,
}: {
  width: number;
  height: number;
  className: string;
  label: string;
  description?: string;
  children: ReactNode;
}) {
  const titleId = useId();
  const descriptionId = useId();
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      className={className}
      role="img"
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
    >
      <title id={titleId}>{label}</title>
      {description ? <desc id={descriptionId}>{description}</desc> : null}
      {children}
    </svg>
  );
}
