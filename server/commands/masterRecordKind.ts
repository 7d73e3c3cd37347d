import type { MasterRecordContent } from "../../shared/schemas/masterRecords.js";
import { masterRecords, masterRecordVersions } from "../db/schema.js";
import type { VersionedKind } from "./versionedDocuments.js";

export const masterRecordKind: VersionedKind<MasterRecordContent> = {
  entityType: "master-record-version",
  what: "master record",
  families: masterRecords,
  versions: masterRecordVersions,
  familyColumn: "masterRecordId",
  derive: () => ({}),
};
