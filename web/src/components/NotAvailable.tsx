import { Link } from "react-router";

/** Shown inside the shell when a screen belongs to a role the person does not hold. */
export function NotAvailable() {
  return (
    <section className="flex max-w-2xl flex-col gap-3">
      <h1 className="text-3xl font-bold">Not available to your roles</h1>
      <p>This screen belongs to a role your account does not hold.</p>
      <p>
        If you need it for your work, ask an administrator to review your roles. Meanwhile,{" "}
        <Link to="/">go to your home</Link>.
      </p>
    </section>
  );
}
