import { z } from "zod";
import { createAttachment, findOwner, listAttachments, ownerWord, type OwnerType } from "@/db/queries/attachments";
import { NotFoundError } from "@/lib/errors";
import { readQuery } from "@/lib/http/body";
import { ApiError } from "@/lib/http/errors";
import { route } from "@/lib/http/route";
import { ATTACHMENT_PERMISSIONS } from "@/lib/permissions";
import { readUploadedFile, type UploadedFile } from "@/lib/uploads/multipart";
import { MAX_PDF_BYTES, pdfProblem } from "@/lib/uploads/pdf";
import { attachmentKindSchema, attachmentOwnerSchema, attachmentOwnerTypeSchema } from "@/lib/validations/uploads";

/** The owner named by ?ownerType=&ownerId= (422 naming the parameter when missing or wrong). */
async function queriedOwner(req: Request) {
  const { ownerType, ownerId } = readQuery(req, attachmentOwnerSchema);
  return { kind: ownerType, ownerId };
}

/** GET /api/attachments?ownerType=material|batch&ownerId=… : the owner's attachments (read permission on the owner). */
export const GET = route({ permission: ATTACHMENT_PERMISSIONS.read, subject: queriedOwner }, async (_req, { team, subject }) => {
  if (!(await findOwner(team.id, subject.kind, subject.ownerId))) throw new NotFoundError(ownerWord(subject.kind));
  return Response.json(await listAttachments(team.id, subject.kind, subject.ownerId));
});

/**
 * The owner type of an upload: from ?ownerType= when given, so that who may
 * upload is known before the body is read; otherwise from the form, read here.
 */
async function uploadOwner(req: Request): Promise<{ kind: OwnerType; upload: UploadedFile | null }> {
  const fromQuery = attachmentOwnerTypeSchema.safeParse(new URL(req.url).searchParams.get("ownerType"));
  if (fromQuery.success) return { kind: fromQuery.data, upload: null };
  const upload = await readUploadedFile(req, MAX_PDF_BYTES);
  const { ownerType } = z.object({ ownerType: attachmentOwnerTypeSchema }).parse(upload.fields);
  return { kind: ownerType, upload };
}

const uploadFieldsSchema = z.object({ ownerId: attachmentOwnerSchema.shape.ownerId, kind: attachmentKindSchema.default("other") });

/**
 * POST /api/attachments (multipart: file, ownerType, ownerId, kind = sds | coa | other; the three may also be query parameters):
 * stores a PDF (checked by content, at most 10 MB) for a material or an open batch record.
 */
export const POST = route({ permission: ATTACHMENT_PERMISSIONS.write, subject: uploadOwner }, async (req, { actor, subject }) => {
  const upload = subject.upload ?? (await readUploadedFile(req, MAX_PDF_BYTES));
  const query = Object.fromEntries(new URL(req.url).searchParams.entries());
  const { ownerId, kind } = uploadFieldsSchema.parse({ ...query, ...upload.fields });
  const problem = pdfProblem(upload.bytes);
  if (problem) throw new ApiError(415, "not_a_pdf", problem, { file: problem });
  const fileName = /\.pdf$/i.test(upload.fileName) ? upload.fileName : `${upload.fileName}.pdf`;
  const created = await createAttachment(actor, { ownerType: subject.kind, ownerId, kind, fileName, contentType: "application/pdf", bytes: upload.bytes });
  return Response.json(created, { status: 201 });
});
