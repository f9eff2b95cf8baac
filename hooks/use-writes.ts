"use client";

/**
 * The screens' writes as React Query mutations. Each one refreshes the query families its
 * change can show up in (a new athlete changes a squad's count, a published session the
 * squad's latest session), so no screen has to know which lists to reload.
 */
import { type QueryKey, useMutation, useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/queries";
import {
  addAthleteRequest,
  adoptTypicalErrorRequest,
  createInvitationRequest,
  createSessionRequest,
  createSquadRequest,
  createTestRequest,
  deleteAthleteRequest,
  deleteSessionRequest,
  deleteTestRequest,
  reliabilityFromFileRequest,
  removeMemberRequest,
  requestDeletionRequest,
  resendInvitationRequest,
  revokeInvitationRequest,
  saveReportRequest,
  updateAthleteRequest,
  updateMemberRequest,
  updateSessionRequest,
  updateSquadRequest,
  updateTestRequest,
} from "@/lib/client/writes";
import type { DeletionRequestInput, InvitationCreateInput, MemberUpdateInput } from "@/lib/validation/people";
import type { ReliabilityFileInput, SavedReportCreateInput, TypicalErrorAdoptInput } from "@/lib/validation/reports";
import type {
  AthleteUpdateInput,
  SquadAthleteAddInput,
  SquadCreateInput,
  SquadUpdateInput,
} from "@/lib/validation/roster";
import type { SessionCreateInput, SessionUpdateInput } from "@/lib/validation/sessions";
import type { TestCreateInput, TestUpdateInput } from "@/lib/validation/tests";

function useWrite<V, R>(request: (vars: V) => Promise<R>, refresh: readonly QueryKey[]) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: request,
    onSettled: () => Promise.all(refresh.map((queryKey) => client.invalidateQueries({ queryKey }))),
  });
}

const ROSTER_FAMILIES = [queryKeys.squads, queryKeys.athletes] as const;
const SESSION_FAMILIES = [queryKeys.sessions, queryKeys.squads] as const;

export const useCreateSquad = () =>
  useWrite((input: SquadCreateInput) => createSquadRequest(input), [queryKeys.squads]);

export const useUpdateSquad = (squadId: number) =>
  useWrite((input: SquadUpdateInput) => updateSquadRequest(squadId, input), [queryKeys.squads]);

export const useAddAthlete = (squadId: number) =>
  useWrite((input: SquadAthleteAddInput) => addAthleteRequest(squadId, input), ROSTER_FAMILIES);

export const useUpdateAthlete = () =>
  useWrite(
    ({ athleteId, input }: { athleteId: number; input: AthleteUpdateInput }) => updateAthleteRequest(athleteId, input),
    [...ROSTER_FAMILIES, queryKeys.sessions],
  );

export const useCreateTest = () => useWrite((input: TestCreateInput) => createTestRequest(input), [queryKeys.tests]);

export const useUpdateTest = () =>
  useWrite(
    ({ testId, input }: { testId: number; input: TestUpdateInput }) => updateTestRequest(testId, input),
    [queryKeys.tests, queryKeys.sessions],
  );

export const useDeleteTest = () => useWrite((testId: number) => deleteTestRequest(testId), [queryKeys.tests]);

export const useCreateSession = () =>
  useWrite((input: SessionCreateInput) => createSessionRequest(input), SESSION_FAMILIES);

export const useUpdateSession = () =>
  useWrite(
    ({ sessionId, input }: { sessionId: number; input: SessionUpdateInput }) => updateSessionRequest(sessionId, input),
    SESSION_FAMILIES,
  );

/** A deleted draft leaves the Sessions list, the squads' latest sessions and What needs doing. */
export const useDeleteSession = () =>
  useWrite(
    ({ sessionId, confirmedResults }: { sessionId: number; confirmedResults: number }) =>
      deleteSessionRequest(sessionId, confirmedResults),
    SESSION_FAMILIES,
  );

export const useSaveReport = () =>
  useWrite((input: SavedReportCreateInput) => saveReportRequest(input), [queryKeys.reports]);

/** A new typical error changes the Test library and every report's individual intervals. */
export const useAdoptTypicalError = () =>
  useWrite(
    ({ testId, input }: { testId: number; input: TypicalErrorAdoptInput }) => adoptTypicalErrorRequest(testId, input),
    [queryKeys.tests, queryKeys.reports],
  );

/** A Reliability check of a two-trial file: a POST that stores nothing, so it refreshes nothing. */
export const useReliabilityFromFile = () =>
  useWrite((input: ReliabilityFileInput) => reliabilityFromFileRequest(input), []);

/** Invitations show on the People page and their mail in the Outbox. */
const INVITATION_FAMILIES = [queryKeys.people, queryKeys.outbox] as const;

export const useCreateInvitation = () =>
  useWrite((input: InvitationCreateInput) => createInvitationRequest(input), INVITATION_FAMILIES);

export const useResendInvitation = () =>
  useWrite((invitationId: number) => resendInvitationRequest(invitationId), INVITATION_FAMILIES);

export const useRevokeInvitation = () =>
  useWrite((invitationId: number) => revokeInvitationRequest(invitationId), INVITATION_FAMILIES);

/** A role change or removal changes who coaches which squad. */
const MEMBER_FAMILIES = [queryKeys.people, queryKeys.coaches, queryKeys.squads] as const;

export const useUpdateMember = () =>
  useWrite(
    ({ userId, input }: { userId: number; input: MemberUpdateInput }) => updateMemberRequest(userId, input),
    MEMBER_FAMILIES,
  );

export const useRemoveMember = () => useWrite((userId: number) => removeMemberRequest(userId), MEMBER_FAMILIES);

/** A deleted athlete leaves rosters, sessions, reports and the result counts of tests. */
export const useDeleteAthlete = () =>
  useWrite(
    (athleteId: number) => deleteAthleteRequest(athleteId),
    [
      queryKeys.people,
      queryKeys.athletes,
      queryKeys.squads,
      queryKeys.sessions,
      queryKeys.reports,
      queryKeys.tests,
      queryKeys.outbox,
    ],
  );

/** The athlete's own request; nothing they can see changes. */
export const useRequestDeletion = () => useWrite((input: DeletionRequestInput) => requestDeletionRequest(input), []);
