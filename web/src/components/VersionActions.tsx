import { Link } from "react-router";
import { useSession } from "../features/session/useSession";
import { Button } from "./Button";
import { ButtonLink } from "./ButtonLink";

export interface VersionActionsProps {
  version: { status: string; createdBy: { id: string }; abilities: { edit: boolean; approve: boolean; succeed: boolean } };
  /** The open draft of the same document, when this version is not it. */
  openDraftHref?: string;
  nextNumber: number;
  compareHref?: string;
  onEdit: () => void;
  onNext: () => void;
  onApprove: () => void;
}

/** What the viewer may do with a version of a rate model or master record, per its abilities. */
export function VersionActions({ version, openDraftHref, nextNumber, compareHref, onEdit, onNext, onApprove }: VersionActionsProps) {
  const { user } = useSession();
  const { abilities } = version;
  const ownDraftForQuality = version.status === "draft" && Boolean(user?.roles.includes("quality")) && version.createdBy.id === user?.id;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap gap-3">
        {abilities.approve && <Button onClick={onApprove}>Approve with signature</Button>}
        {abilities.edit && (
          <Button variant={abilities.approve ? "secondary" : "primary"} onClick={onEdit}>
            Edit draft
          </Button>
        )}
        {abilities.succeed && <Button onClick={onNext}>Draft version {nextNumber}</Button>}
        {compareHref && (
          <ButtonLink variant="secondary" to={compareHref}>
            Compare versions
          </ButtonLink>
        )}
      </div>
      {ownDraftForQuality && <p>You drafted this version, so someone else in quality must approve it.</p>}
      {version.status !== "draft" && openDraftHref && (
        <p>
          A newer draft is open: <Link to={openDraftHref}>go to the draft</Link>.
        </p>
      )}
    </div>
  );
}
