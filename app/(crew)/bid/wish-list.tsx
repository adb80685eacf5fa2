"use client";

import {
  DndContext,
  KeyboardSensor,
  PointerSensor,
  TouchSensor,
  closestCenter,
  useSensor,
  useSensors,
  type DragEndEvent,
} from "@dnd-kit/core";
import { SortableContext, arrayMove, sortableKeyboardCoordinates, useSortable, verticalListSortingStrategy } from "@dnd-kit/sortable";
import { CSS } from "@dnd-kit/utilities";
import type { Wish } from "@/lib/domain/wish";
import { wishSentence } from "@/lib/domain/wish-sentence";
import { KIND_LABEL } from "./kind-label";

export interface Item {
  key: string;
  wish: Wish;
}

interface Props {
  items: Item[];
  disabled: boolean;
  /** server messages per rank */
  problems: Record<number, string>;
  onReorder: (items: Item[]) => void;
  onEdit: (key: string) => void;
  onDuplicate: (key: string) => void;
  onRemove: (key: string) => void;
}

/**
 * The ranked wishes. Reorder by dragging the handle (touch, mouse), by the
 * handle and the arrow keys (dnd-kit's keyboard sensor: space, arrows,
 * space), or with the Up and Down buttons.
 */
export function WishList({ items, disabled, problems, onReorder, onEdit, onDuplicate, onRemove }: Props) {
  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 4 } }),
    useSensor(TouchSensor, { activationConstraint: { delay: 120, tolerance: 8 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );
  const move = (from: number, to: number) => {
    if (to < 0 || to >= items.length) return;
    onReorder(arrayMove(items, from, to));
  };
  function dragEnd(e: DragEndEvent) {
    if (!e.over || e.active.id === e.over.id) return;
    move(
      items.findIndex((i) => i.key === e.active.id),
      items.findIndex((i) => i.key === e.over!.id),
    );
  }
  const announcements = {
    onDragStart: ({ active }: { active: { id: string | number } }) => `Picked up wish ${rank(active.id)}.`,
    onDragOver: ({ active, over }: { active: { id: string | number }; over: { id: string | number } | null }) =>
      over ? `Wish ${rank(active.id)} is over place ${rank(over.id)}.` : `Wish ${rank(active.id)} is not over a place.`,
    onDragEnd: ({ active, over }: { active: { id: string | number }; over: { id: string | number } | null }) =>
      over ? `Wish ${rank(active.id)} dropped at place ${rank(over.id)}.` : `Wish ${rank(active.id)} dropped.`,
    onDragCancel: ({ active }: { active: { id: string | number } }) => `Moving wish ${rank(active.id)} was cancelled.`,
  };
  const rank = (id: string | number) => items.findIndex((i) => i.key === id) + 1;

  if (items.length === 0) {
    return <p className="mt-4 rounded-lg border border-dashed border-slate-400 bg-white px-4 py-6 text-center text-base text-slate-800">No wishes yet. Add your first one below.</p>;
  }
  return (
    <DndContext
      sensors={sensors}
      collisionDetection={closestCenter}
      onDragEnd={dragEnd}
      accessibility={{
        announcements,
        screenReaderInstructions: { draggable: "To move a wish, press space on its handle, use the arrow keys, then press space again to drop it, or escape to cancel." },
      }}
    >
      <SortableContext items={items.map((i) => i.key)} strategy={verticalListSortingStrategy}>
        <ol className="mt-4 space-y-3" aria-label="My wishes, most wanted first">
          {items.map((item, k) => (
            <Row
              key={item.key}
              item={item}
              rank={k + 1}
              last={k === items.length - 1}
              disabled={disabled}
              problem={problems[k]}
              onUp={() => move(k, k - 1)}
              onDown={() => move(k, k + 1)}
              onEdit={() => onEdit(item.key)}
              onDuplicate={() => onDuplicate(item.key)}
              onRemove={() => onRemove(item.key)}
            />
          ))}
        </ol>
      </SortableContext>
    </DndContext>
  );
}

const small = "min-h-11 min-w-11 rounded-md border border-slate-400 bg-white px-2.5 text-sm font-medium text-slate-900 disabled:opacity-50";

function Row(props: {
  item: Item;
  rank: number;
  last: boolean;
  disabled: boolean;
  problem: string | undefined;
  onUp: () => void;
  onDown: () => void;
  onEdit: () => void;
  onDuplicate: () => void;
  onRemove: () => void;
}) {
  const { item, rank } = props;
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id: item.key, disabled: props.disabled });
  const sentence = wishSentence(item.wish);
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={`rounded-lg border bg-white px-3 py-3 shadow-sm ${isDragging ? "relative z-10 border-sky-800 shadow-lg" : props.problem ? "border-red-700" : "border-slate-300"}`}
      data-wish={rank}
    >
      <div className="flex items-start gap-3">
        <button
          type="button"
          ref={setActivatorNodeRef}
          {...attributes}
          {...listeners}
          aria-label={`Move wish ${rank}`}
          className="flex h-12 w-11 shrink-0 touch-none items-center justify-center rounded-md border border-slate-400 bg-slate-100 text-slate-800"
          data-handle
        >
          <svg aria-hidden="true" viewBox="0 0 20 20" className="h-5 w-5" fill="currentColor">
            <circle cx="7" cy="5" r="1.6" />
            <circle cx="13" cy="5" r="1.6" />
            <circle cx="7" cy="10" r="1.6" />
            <circle cx="13" cy="10" r="1.6" />
            <circle cx="7" cy="15" r="1.6" />
            <circle cx="13" cy="15" r="1.6" />
          </svg>
        </button>
        <div className="min-w-0 flex-1">
          <p className="text-xs font-medium uppercase tracking-wide text-slate-700">
            #{rank} · {KIND_LABEL[item.wish.kind]}
          </p>
          <p className="text-base font-medium text-slate-950" data-sentence>
            {sentence}
          </p>
          {props.problem ? <p className="mt-1 text-sm font-medium text-red-800">{props.problem}</p> : null}
        </div>
      </div>
      <div className="mt-2 flex flex-wrap gap-1.5">
        <button type="button" className={small} onClick={props.onUp} disabled={props.disabled || rank === 1} aria-label={`Move wish ${rank} up`}>
          <span aria-hidden="true">↑</span>
        </button>
        <button type="button" className={small} onClick={props.onDown} disabled={props.disabled || props.last} aria-label={`Move wish ${rank} down`}>
          <span aria-hidden="true">↓</span>
        </button>
        <button type="button" className={small} onClick={props.onEdit} disabled={props.disabled} aria-label={`Edit wish ${rank}`}>
          Edit
        </button>
        <button type="button" className={small} onClick={props.onDuplicate} disabled={props.disabled} aria-label={`Copy wish ${rank}`}>
          Copy
        </button>
        <button type="button" className={small} onClick={props.onRemove} disabled={props.disabled} aria-label={`Remove wish ${rank}`}>
          Remove
        </button>
      </div>
    </li>
  );
}
