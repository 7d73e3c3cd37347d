/** A titled panel saying what a screen section will list once its feature is built. */
export function PlannedList({ title, description }: { title: string; description: string }) {
  return (
    <section aria-labelledby={`${slug(title)}-title`} className="rounded-lg border-2 border-dashed border-ink-300 bg-white p-5">
      <h2 id={`${slug(title)}-title`} className="text-xl font-bold">
        {title}
      </h2>
      <p className="mt-1 text-ink-700">{description}</p>
      <p className="mt-2 text-[0.9rem] font-semibold text-ink-600">Not built yet.</p>
    </section>
  );
}

function slug(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, "-");
}
