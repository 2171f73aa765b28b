import "server-only";
import { randomUUID } from "node:crypto";
import { db } from "@/lib/db/sequelize";
import { AppError, notFound } from "@/lib/errors";
import { findAssessment } from "@/lib/data/assessments";
import { findPlotByNumber } from "@/lib/data/plots";
import { deleteObject, objectSize, presignUpload, readObject } from "@/lib/storage/objects";
import type { SessionUser } from "@/lib/auth/session";
import type { StartPhotoInput } from "@/lib/validations/photos";
import { Photo, type Trial } from "@/models";

const signatures: Record<string, number[]> = {
  "image/jpeg": [0xff, 0xd8, 0xff],
  "image/png": [0x89, 0x50, 0x4e, 0x47],
  "image/webp": [0x52, 0x49, 0x46, 0x46],
};

export async function photoTrialId(photoId: string): Promise<string> {
  db();
  const photo = await Photo.findByPk(photoId, { attributes: ["trialId"] });
  if (!photo) throw notFound("photo");
  return photo.trialId;
}

export async function startPhoto(user: SessionUser, trial: Trial, input: StartPhotoInput) {
  if (trial.status === "published") throw new AppError("CONFLICT", "This trial is published; photos can no longer be added.");
  const [plot, assessment] = await Promise.all([
    findPlotByNumber(trial.id, input.plotNumber),
    input.assessmentId ? findAssessment(trial.id, input.assessmentId) : null,
  ]);
  if (!plot) throw new AppError("NOT_FOUND", `Plot ${input.plotNumber} is not in this trial.`);
  // The id comes from the client: one of another trial's assessments must not be linked here.
  if (input.assessmentId && !assessment) throw notFound("assessment");
  const id = randomUUID();
  const objectKey = `trials/${trial.id}/photos/${id}`;
  const thumbnailKey = `${objectKey}-thumbnail.jpg`;
  const [putUrl, thumbnailPutUrl] = await Promise.all([
    presignUpload(objectKey, input.contentType, input.sizeBytes),
    presignUpload(thumbnailKey, "image/jpeg", input.thumbnailBytes),
  ]);
  await Photo.create({
    id,
    trialId: trial.id,
    plotId: plot.id,
    assessmentId: input.assessmentId,
    objectKey,
    thumbnailKey,
    contentType: input.contentType,
    sizeBytes: input.sizeBytes,
    caption: input.caption,
    uploadedById: user.id,
  });
  return { photoId: id, putUrl, thumbnailPutUrl };
}

async function startsWith(key: string, bytes: number[]): Promise<boolean> {
  for await (const chunk of await readObject(key)) return bytes.every((byte, index) => chunk[index] === byte);
  return false;
}

/** Both files must have arrived at their announced size and be the image type announced. */
export async function confirmPhoto(photoId: string): Promise<{ photoId: string }> {
  db();
  const photo = await Photo.findByPk(photoId);
  if (!photo) throw notFound("photo");
  if (photo.status === "stored") return { photoId };
  const [size, thumbnailSize] = await Promise.all([objectSize(photo.objectKey), objectSize(photo.thumbnailKey)]);
  if (size !== photo.sizeBytes || thumbnailSize === null) throw new AppError("CONFLICT", "The photo has not fully arrived in storage. Send it again.");
  const genuine = (await startsWith(photo.objectKey, signatures[photo.contentType])) && (await startsWith(photo.thumbnailKey, signatures["image/jpeg"]));
  if (!genuine) {
    await Promise.all([deleteObject(photo.objectKey), deleteObject(photo.thumbnailKey)]);
    await photo.destroy();
    throw new AppError("INVALID_INPUT", "That file is not the image it claimed to be; it was discarded.");
  }
  await photo.update({ status: "stored" });
  return { photoId };
}

export async function photoFile(photoId: string, size: "thumbnail" | "original") {
  db();
  const photo = await Photo.findByPk(photoId);
  if (!photo || photo.status !== "stored") throw notFound("photo");
  const key = size === "thumbnail" ? photo.thumbnailKey : photo.objectKey;
  return { body: await readObject(key), contentType: size === "thumbnail" ? "image/jpeg" : photo.contentType };
}

export async function photosOfPlot(trialId: string, plotId: string) {
  db();
  const photos = await Photo.findAll({ where: { trialId, plotId, status: "stored" }, order: [["createdAt", "DESC"]], limit: 60 });
  return photos.map((photo) => ({ id: photo.id, caption: photo.caption, assessmentId: photo.assessmentId, createdAt: photo.createdAt }));
}
