import { z } from "zod";

export const uuidSchema = z.uuid("That id is not valid.");
export const trialIdParams = z.object({ trialId: uuidSchema }).strict();
