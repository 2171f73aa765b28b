import { uuidSchema } from "@/lib/validations/common";

export const isUuid = (value: string) => uuidSchema.safeParse(value).success;
