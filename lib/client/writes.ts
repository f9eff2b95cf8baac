/**
 * Every write the screens send, typed at both ends: the body is the input of the zod schema the
 * route validates with, the answer the return type of the lib/data function that performs it.
 * Components run these through React Query mutations (`hooks/use-writes.ts`), never bare.
 */
import type { deleteAthlete } from "@/lib/data/athlete-deletion";
import type { addAthleteToSquad, updateAthlete } from "@/lib/data/athletes";
import type { requestDeletion } from "@/lib/data/deletion-requests";
import type { acceptInvitation, createInvitation, resendInvitation, revokeInvitation } from "@/lib/data/invitations";
import type { removeMember, updateMemberRole } from "@/lib/data/members";
import type { confirmPasswordReset } from "@/lib/data/password-reset";
import type { adoptTypicalError, getReliabilityFromFile } from "@/lib/data/reliability";
import type { saveReport } from "@/lib/data/reports";
import type { writeResults } from "@/lib/data/results";
import type { deleteDraftSession } from "@/lib/data/session-delete";
import type { createSession, updateSession } from "@/lib/data/sessions";
import type { createSquad, updateSquad } from "@/lib/data/squads";
import type { createTest, deleteOrArchiveTest, updateTest } from "@/lib/data/tests";
import type { undoLastChange } from "@/lib/data/undo";
import type {
  DeletionRequestInput,
  InvitationAcceptInput,
  InvitationCreateInput,
  MemberUpdateInput,
  PasswordResetConfirmInput,
  PasswordResetRequestInput,
} from "@/lib/validation/people";
import type { ReliabilityFileInput, SavedReportCreateInput, TypicalErrorAdoptInput } from "@/lib/validation/reports";
import type {
  AthleteUpdateInput,
  SquadAthleteAddInput,
  SquadCreateInput,
  SquadUpdateInput,
} from "@/lib/validation/roster";
import type { ResultWriteInput, SessionCreateInput, SessionUpdateInput } from "@/lib/validation/sessions";
import type { TestCreateInput, TestUpdateInput } from "@/lib/validation/tests";
import { fetchJson } from "./fetch-json";
import type { Loaded } from "./queries";

const send = <T>(url: string, method: "POST" | "PATCH" | "PUT" | "DELETE", body?: unknown) =>
  fetchJson<T>(url, { method, ...(body === undefined ? {} : { body: JSON.stringify(body) }) });

export const createSquadRequest = (input: SquadCreateInput) =>
  send<{ squad: Loaded<typeof createSquad> }>("/api/squads", "POST", input).then((r) => r.squad);

export const updateSquadRequest = (squadId: number, input: SquadUpdateInput) =>
  send<{ squad: Loaded<typeof updateSquad> }>(`/api/squads/${squadId}`, "PATCH", input).then((r) => r.squad);

export const addAthleteRequest = (squadId: number, input: SquadAthleteAddInput) =>
  send<{ athlete: Loaded<typeof addAthleteToSquad> }>(`/api/squads/${squadId}/athletes`, "POST", input).then(
    (r) => r.athlete,
  );

export const updateAthleteRequest = (athleteId: number, input: AthleteUpdateInput) =>
  send<{ athlete: Loaded<typeof updateAthlete> }>(`/api/athletes/${athleteId}`, "PATCH", input).then((r) => r.athlete);

export const createTestRequest = (input: TestCreateInput) =>
  send<{ test: Loaded<typeof createTest> }>("/api/tests", "POST", input).then((r) => r.test);

export const updateTestRequest = (testId: number, input: TestUpdateInput) =>
  send<{ test: Loaded<typeof updateTest> }>(`/api/tests/${testId}`, "PATCH", input).then((r) => r.test);

export const deleteTestRequest = (testId: number) =>
  send<Loaded<typeof deleteOrArchiveTest>>(`/api/tests/${testId}`, "DELETE");

export const createSessionRequest = (input: SessionCreateInput) =>
  send<{ session: Loaded<typeof createSession> }>("/api/sessions", "POST", input).then((r) => r.session);

export const updateSessionRequest = (sessionId: number, input: SessionUpdateInput) =>
  send<{ session: Loaded<typeof updateSession> }>(`/api/sessions/${sessionId}`, "PATCH", input).then((r) => r.session);

export const deleteSessionRequest = (sessionId: number, confirmedResults: number) =>
  send<Loaded<typeof deleteDraftSession>>(`/api/sessions/${sessionId}?results=${confirmedResults}`, "DELETE");

export const saveResultsRequest = (sessionId: number, results: ResultWriteInput[]) =>
  send<{ results: Loaded<typeof writeResults> }>(`/api/sessions/${sessionId}/results`, "PUT", { results }).then(
    (r) => r.results,
  );

export const undoRequest = (sessionId: number) =>
  send<{ undone: Loaded<typeof undoLastChange> }>(`/api/sessions/${sessionId}/undo`, "POST").then((r) => r.undone);

export const saveReportRequest = (input: SavedReportCreateInput) =>
  send<{ report: Loaded<typeof saveReport> }>("/api/reports/notes", "POST", input).then((r) => r.report);

/** Not a write: the file's scores travel in a POST body because they are too long for a URL, and are not stored. */
export const reliabilityFromFileRequest = (input: ReliabilityFileInput) =>
  send<Loaded<typeof getReliabilityFromFile>>("/api/reports/reliability/file", "POST", input);

export const adoptTypicalErrorRequest = (testId: number, input: TypicalErrorAdoptInput) =>
  send<{ test: Loaded<typeof adoptTypicalError> }>(`/api/tests/${testId}/typical-error`, "POST", input).then(
    (r) => r.test,
  );

export const createInvitationRequest = (input: InvitationCreateInput) =>
  send<{ invitation: Loaded<typeof createInvitation> }>("/api/invitations", "POST", input).then((r) => r.invitation);

export const resendInvitationRequest = (invitationId: number) =>
  send<{ invitation: Loaded<typeof resendInvitation> }>(`/api/invitations/${invitationId}/resend`, "POST").then(
    (r) => r.invitation,
  );

export const revokeInvitationRequest = (invitationId: number) =>
  send<{ revoked: Loaded<typeof revokeInvitation> }>(`/api/invitations/${invitationId}`, "DELETE").then(
    (r) => r.revoked,
  );

export const updateMemberRequest = (userId: number, input: MemberUpdateInput) =>
  send<{ member: Loaded<typeof updateMemberRole> }>(`/api/members/${userId}`, "PATCH", input).then((r) => r.member);

export const removeMemberRequest = (userId: number) =>
  send<{ removed: Loaded<typeof removeMember> }>(`/api/members/${userId}`, "DELETE").then((r) => r.removed);

export const deleteAthleteRequest = (athleteId: number) =>
  send<{ deleted: Loaded<typeof deleteAthlete> }>(`/api/athletes/${athleteId}`, "DELETE").then((r) => r.deleted);

export const requestDeletionRequest = (input: DeletionRequestInput) =>
  send<Loaded<typeof requestDeletion>>("/api/me/deletion-request", "POST", input);

// Signed-out pages (no QueryClient there, as on the sign-in page): plain requests.
export const acceptInvitationRequest = (input: InvitationAcceptInput) =>
  send<{ accepted: Loaded<typeof acceptInvitation> }>("/api/invitations/accept", "POST", input).then((r) => r.accepted);

export const passwordResetRequest = (input: PasswordResetRequestInput) =>
  send<{ requested: true; message: string }>("/api/password-reset", "POST", input);

export const passwordResetConfirmRequest = (input: PasswordResetConfirmInput) =>
  send<{ reset: Loaded<typeof confirmPasswordReset> }>("/api/password-reset/confirm", "POST", input).then(
    (r) => r.reset,
  );
