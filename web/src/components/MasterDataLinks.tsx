import { Link } from "react-router";

const PAGES = [
  { to: "/vessels", label: "Vessels", text: "Pressure and volume ratings of each batch vessel." },
  { to: "/rate-models", label: "Rate models", text: "Versions of the kinetic models, drafted and approved." },
  { to: "/master-records", label: "Master records", text: "The steps and entries each batch record is built from." },
  { to: "/campaigns", label: "Campaigns", text: "Campaigns on approved versions, and their planned batches." },
];

/** Links to the master-data screens with one line on each, for the role homes. */
export function MasterDataLinks() {
  return (
    <nav aria-labelledby="master-data-links-title" className="rounded-lg border-2 border-ink-200 bg-white p-5">
      <h2 id="master-data-links-title" className="text-xl font-bold">
        Master data
      </h2>
      <ul className="mt-2 grid gap-2 sm:grid-cols-2">
        {PAGES.map((page) => (
          <li key={page.to}>
            <Link to={page.to} className="inline-flex min-h-11 items-center font-semibold">
              {page.label}
            </Link>
            <p className="text-[0.9rem] text-ink-700">{page.text}</p>
          </li>
        ))}
      </ul>
    </nav>
  );
}
