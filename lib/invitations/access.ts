import "server-only";
import { db } from "@/lib/db/sequelize";
import { notFound } from "@/lib/errors";
import { Invitation } from "@/models";

/** The trial an invitation belongs to, so the guard checks team rights on that trial. */
export async function trialOfInvitation(invitationId: string): Promise<string> {
  db();
  const invitation = await Invitation.findByPk(invitationId, { attributes: ["trialId"] });
  if (!invitation) throw notFound("invitation");
  return invitation.trialId;
}

export async function invitationOfTrial(invitationId: string, trialId: string): Promise<Invitation> {
  db();
  const invitation = await Invitation.findOne({ where: { id: invitationId, trialId } });
  if (!invitation) throw notFound("invitation");
  return invitation;
}
