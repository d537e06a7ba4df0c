// A key on a track: a marker at its time that can be picked up and dragged
// along the track (pointer, or Space and the arrow keys), and clicked to select.
// Its place comes from the store, not from the drag's offset: the drag moves
// the key itself, so the bars, flags and plots follow while it moves.
import { useDraggable } from "@dnd-kit/core";
import { memo } from "react";
import { legBackground } from "~/components/robot-view";
import type { KeyRef } from "~/stores/editor-store";

export type KeyMarkerProps = {
  keyRef: KeyRef;
  t: number;
  contact?: "stance" | "swing";
  legIndex: number;
  label: string;
  selected: boolean;
  disabled: boolean;
  onSelect: (ref: KeyRef) => void;
};

export const KeyMarker = memo(function KeyMarker({ keyRef, t, contact, legIndex, label, selected, disabled, onSelect }: KeyMarkerProps) {
  const { attributes, listeners, setNodeRef, isDragging } = useDraggable({
    id: `key:${keyRef.legId ?? "body"}:${keyRef.index}`,
    data: { ref: keyRef },
    disabled,
  });
  // Lift-off keys point up, touch-down keys are solid diamonds, body keys squares: shape as well as colour.
  const shape =
    keyRef.legId === null
      ? "h-3 w-3 rounded-[2px] bg-ink"
      : contact === "swing"
        ? `h-3 w-3 rotate-45 border-2 border-ink bg-surface`
        : `h-3 w-3 rotate-45 border border-ink ${legBackground(legIndex)}`;
  return (
    <button
      ref={setNodeRef}
      type="button"
      {...attributes}
      {...listeners}
      aria-label={label}
      aria-pressed={selected}
      // Read-only keys cannot be dragged but can still be selected and inspected.
      aria-disabled={undefined}
      aria-roledescription={disabled ? undefined : attributes["aria-roledescription"]}
      onClick={() => onSelect(keyRef)}
      data-key={`${keyRef.legId ?? "body"}:${keyRef.index}`}
      // The focus ring (an outline, 2 px off the key) differs from the selection's ring, so a keyboard user sees both.
      className={`absolute top-1/2 z-10 flex h-6 w-6 -translate-x-1/2 -translate-y-1/2 items-center justify-center rounded-full focus-visible:z-20 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-ink ${
        selected ? "bg-accent-soft ring-2 ring-accent" : "hover:bg-sunken"
      } ${isDragging ? "cursor-grabbing" : disabled ? "cursor-pointer" : "cursor-grab"} touch-none`}
      style={{ left: `${t * 100}%` }}
    >
      <span aria-hidden className={shape} />
      {contact === "swing" ? (
        <span aria-hidden className="absolute -top-0.5 text-[9px] leading-none text-ink">
          ▴
        </span>
      ) : null}
    </button>
  );
});
