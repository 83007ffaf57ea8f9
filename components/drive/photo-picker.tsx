"use client";

import { useEffect, useId, useMemo } from "react";
import { Button, buttonClasses } from "@/components/ui";
import { shrinkPhoto } from "@/lib/offline";

/**
 * Photos from the phone's camera (or its gallery), shown as thumbnails that can be removed.
 * Each is made smaller on the phone before it waits to be sent.
 */
export function PhotoPicker({
  photos,
  onChange,
  max = 6,
  label = "Take a photo",
  idPrefix,
  error,
}: {
  photos: File[];
  onChange: (photos: File[]) => void;
  max?: number;
  label?: string;
  idPrefix?: string;
  error?: string | undefined;
}) {
  const auto = useId();
  const id = idPrefix ?? `photo${auto}`;
  const previews = useMemo(() => photos.map((p) => ({ file: p, url: URL.createObjectURL(p) })), [photos]);
  useEffect(() => () => previews.forEach((p) => URL.revokeObjectURL(p.url)), [previews]);

  const add = async (list: FileList | null) => {
    if (!list || list.length === 0) return;
    const room = Math.max(0, max - photos.length);
    const picked = [...list].slice(0, room);
    const smaller = await Promise.all(picked.map((f) => shrinkPhoto(f)));
    onChange([...photos, ...smaller]);
  };

  const full = photos.length >= max;
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        <label htmlFor={`${id}-camera`} className={buttonClasses({ variant: "secondary", size: "lg", className: full ? "pointer-events-none opacity-60" : "cursor-pointer" })}>
          {label}
        </label>
        <input
          id={`${id}-camera`}
          type="file"
          accept="image/*"
          capture="environment"
          className="sr-only"
          disabled={full}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(e) => {
            void add(e.currentTarget.files);
            e.currentTarget.value = "";
          }}
        />
        <label htmlFor={`${id}-gallery`} className={buttonClasses({ variant: "ghost", size: "lg", className: full ? "pointer-events-none opacity-60" : "cursor-pointer" })}>
          From the phone
        </label>
        <input
          id={`${id}-gallery`}
          type="file"
          accept="image/*"
          multiple
          className="sr-only"
          disabled={full}
          onChange={(e) => {
            void add(e.currentTarget.files);
            e.currentTarget.value = "";
          }}
        />
      </div>
      {error && (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger">
          {error}
        </p>
      )}
      {previews.length > 0 && (
        <ul className="flex flex-wrap gap-3" aria-label="Photos added">
          {previews.map((p, i) => (
            <li key={p.url} className="flex flex-col items-center gap-1">
              {/* A local preview of a file on the phone: next/image cannot optimise it. */}
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img src={p.url} alt={`Photo ${i + 1}`} className="size-24 rounded-md border border-line object-cover" />
              <Button type="button" size="lg" variant="ghost" onClick={() => onChange(photos.filter((x) => x !== p.file))} aria-label={`Remove photo ${i + 1}`}>
                Remove
              </Button>
            </li>
          ))}
        </ul>
      )}
      <p className="text-sm text-muted">
        {photos.length} of {max} photos
      </p>
    </div>
  );
}
