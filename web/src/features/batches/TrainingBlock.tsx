import { Link } from "react-router";

/** The sentence beside a step's disabled controls: the viewer's training does not allow them now. */
export function TrainingBlock({ id, message }: { id: string; message: string }) {
  return (
    <div id={id} className="rounded-md border-l-8 border-alarm-800 bg-alarm-50 px-4 py-3">
      <p className="font-semibold text-alarm-800">{message}</p>
      <p className="mt-1">
        <Link to="/training">See your training records</Link>
      </p>
    </div>
  );
}
