import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useNavigate, useParams } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { Notice } from "../components/Notice";
import { QueryState } from "../components/QueryState";
import { ApprovalDialog } from "../components/ApprovalDialog";
import { VersionSidebar } from "../components/VersionSidebar";
import { StatusBadge } from "../components/StatusBadge";
import { VersionActions } from "../components/VersionActions";
import { MasterRecordForm } from "../features/masterRecords/MasterRecordForm";
import { contentToForm } from "../features/masterRecords/masterRecordFormValues";
import { MasterRecordOverview } from "../features/masterRecords/MasterRecordOverview";
import { useApproveMasterRecordMutation } from "../features/masterRecords/mutations";
import { masterRecordVersionQueryOptions, masterRecordVersionsQueryOptions } from "../features/masterRecords/queries";

type Mode = "view" | "edit" | "next";
type Message = { tone: "success" | "error"; text: string };

const versionHref = (id: string) => `/master-records/versions/${id}`;

/** One master-record version: the steps as operators see them; build a draft, approve it, or start the next. */
export default function MasterRecordVersion() {
  const { versionId = "" } = useParams();
  // A fresh screen per version, so messages and open forms do not carry over.
  return <VersionScreen key={versionId} versionId={versionId} />;
}

function VersionScreen({ versionId }: { versionId: string }) {
  const navigate = useNavigate();
  const query = useQuery(masterRecordVersionQueryOptions(versionId));
  const recordId = query.data?.masterRecordId;
  const siblings = useQuery({ ...masterRecordVersionsQueryOptions(recordId ?? ""), enabled: Boolean(recordId) });
  const approve = useApproveMasterRecordMutation();
  const [mode, setMode] = useState<Mode>("view");
  const [signing, setSigning] = useState(false);
  const [message, setMessage] = useState<Message | null>(null);
  const version = query.data;

  const others = siblings.data ?? [];
  const openDraft = others.find((v) => v.status === "draft" && v.id !== versionId);
  const nextNumber = Math.max(0, ...others.map((v) => v.version)) + 1;
  const subject = version ? `Master record ${version.code} version ${version.version}` : "";

  const show = (next: Mode) => {
    setMessage(null);
    setMode(next);
  };

  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/master-records", label: "Master records" }, { label: version ? `${version.code} version ${version.version}` : "Version" }]} />
      <QueryState isPending={query.isPending} error={query.error} onRetry={() => void query.refetch()} what="the master-record version">
        {version && (
          <>
            <div className="flex max-w-3xl flex-col gap-2">
              <h1 className="flex flex-wrap items-center gap-3 text-3xl font-bold">
                {version.code} version {version.version} <StatusBadge status={version.status} />
              </h1>
              <p className="text-ink-800">{version.title}</p>
            </div>
            <div aria-live="polite">{message && <Notice tone={message.tone}>{message.text}</Notice>}</div>
            {mode === "view" ? (
              <VersionActions
                version={version}
                openDraftHref={openDraft ? versionHref(openDraft.id) : undefined}
                nextNumber={nextNumber}
                onEdit={() => show("edit")}
                onNext={() => show("next")}
                onApprove={() => {
                  setMessage(null);
                  setSigning(true);
                }}
              />
            ) : (
              <Notice>
                {mode === "edit"
                  ? `You are changing draft version ${version.version} (revision ${version.revision}). The change is kept in the audit trail with your reason.`
                  : `You are drafting version ${nextNumber}, starting from the steps of version ${version.version}. Nothing is saved until you save the draft.`}
              </Notice>
            )}
            {mode !== "view" && (
              <MasterRecordForm
                key={`${mode}-${version.revision}`}
                mode={mode === "edit" ? "edit" : "draft"}
                draft={mode === "edit" ? version : undefined}
                recordId={version.masterRecordId}
                initial={contentToForm(version.content)}
                submitLabel={mode === "edit" ? "Save changes to the draft" : `Save draft version ${nextNumber}`}
                onCancel={() => show("view")}
                onSaved={(saved) => {
                  setMode("view");
                  if (saved.id !== version.id) navigate(versionHref(saved.id));
                  else setMessage({ tone: "success", text: `The draft was saved (revision ${saved.revision}).` });
                }}
              />
            )}
            {mode === "view" && (
              <div className="grid items-start gap-6 xl:grid-cols-[3fr_2fr]">
                <MasterRecordOverview content={version.content} idPrefix={`mr-${version.id}`} />
                <VersionSidebar idPrefix="mr" version={version} versions={others} hrefFor={versionHref} />
              </div>
            )}
            <ApprovalDialog
              open={signing}
              subject={subject}
              approve={(signature) => approve.mutateAsync({ id: version.id, ...signature })}
              onClose={() => setSigning(false)}
              onOutcome={setMessage}
            />
          </>
        )}
      </QueryState>
    </div>
  );
}
