import type { Sequelize } from 'sequelize';
import { recordAudit } from '../audit/audit.service.js';
import { Job } from '../jobs/job.model.js';
import { enqueueJob } from '../jobs/jobs.service.js';
import type { Actor } from '../runs/actor.js';
import { ValidationError } from '../shared/errors.js';
import { Spec } from '../specs/spec.model.js';
import { Upload } from './upload.model.js';

export interface UploadView {
  id: string;
  fileName: string;
  originalName: string;
  contentType: string;
  sha256: string;
  size: number;
  specName: string | null;
  jobId: string;
  jobState: string | null;
  jobOutcome: string | null;
  uploaderName: string;
  createdAt: string;
}

function uploadView(upload: Upload, job: Job | undefined): UploadView {
  return {
    id: String(upload.id),
    fileName: upload.fileName,
    originalName: upload.originalName,
    contentType: upload.contentType,
    sha256: upload.sha256,
    size: upload.size,
    specName: upload.specName,
    jobId: String(upload.jobId),
    jobState: job?.state ?? null,
    jobOutcome: job?.outcome ?? null,
    uploaderName: upload.uploaderName,
    createdAt: upload.createdAt.toISOString(),
  };
}

export interface NewUpload {
  originalName: string;
  fileName: string;
  contentType: string;
  sha256: string;
  size: number;
  specName: string | undefined;
}

/** Records a stored file and queues the upload job a worker turns into runs, in one transaction. */
export async function createUpload(sequelize: Sequelize, actor: Actor, file: NewUpload, requestId: string | null): Promise<UploadView> {
  return sequelize.transaction(async (transaction) => {
    if (file.specName !== undefined && !(await Spec.findOne({ where: { name: file.specName }, transaction }))) {
      throw new ValidationError(`No spec named ${file.specName}`, { issues: [{ in: 'body', path: 'spec', message: 'no spec with this name' }] });
    }
    const payload = { fileName: file.fileName, sha256: file.sha256, size: file.size, specName: file.specName ?? null };
    const job = await enqueueJob(transaction, actor, 'upload', payload, requestId);
    const upload = await Upload.create(
      { ...file, specName: file.specName ?? null, jobId: job.id, uploaderId: actor.id, uploaderName: actor.name },
      { transaction },
    );
    await job.update({ payload: { ...payload, uploadId: String(upload.id) } }, { transaction });
    await recordAudit(transaction, { actor: actor.principal, action: 'upload.create', entityType: 'upload', entityId: upload.id, after: { ...payload, jobId: job.id }, requestId });
    return uploadView(upload, job);
  });
}

export async function listUploads(page: number, pageSize: number): Promise<{ items: UploadView[]; page: number; pageSize: number; total: number }> {
  const { rows, count } = await Upload.findAndCountAll({ order: [['id', 'DESC']], limit: pageSize, offset: (page - 1) * pageSize });
  const jobs = await Job.findAll({ where: { id: rows.map((u) => u.jobId) }, attributes: ['id', 'state', 'outcome'] });
  const jobById = new Map(jobs.map((j) => [j.id, j]));
  return { items: rows.map((u) => uploadView(u, jobById.get(u.jobId))), page, pageSize, total: count };
}
