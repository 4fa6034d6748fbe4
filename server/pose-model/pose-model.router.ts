import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import express, { type Router } from 'express';
import { notFound } from '@/server/http/errors';
import { POSE_MODEL_BASE, POSE_PACKAGE, POSE_PACKAGE_VERSION } from '@/features/pose-suggestion/model-files';

/** The files the browser runtime asks for; the package's README and typings are not served. */
const SERVED = /^\/(pose\.js|pose_solution_[a-z_]+\.(js|wasm|data)|pose_landmark_(lite|full|heavy)\.tflite|pose_web\.binarypb)$/;

/** The installed package's folder, checked against the version the app asks for. */
export function poseModelDir(): string {
  const manifest = createRequire(__filename).resolve(`${POSE_PACKAGE}/package.json`);
  const { version } = JSON.parse(fs.readFileSync(manifest, 'utf8')) as { version: string };
  if (version !== POSE_PACKAGE_VERSION) {
    throw new Error(`${POSE_PACKAGE} ${version} is installed but the app expects ${POSE_PACKAGE_VERSION}: update model-files.ts with the package.`);
  }
  return path.dirname(manifest);
}

/**
 * The pose model and its WebAssembly runtime, served from our own origin for the suggested points. The path
 * carries the package version, so the files are cached for a year; anything else under it is a 404.
 */
export function poseModelRouter(): Router {
  const dir = poseModelDir();
  const router = express.Router();
  const files = express.static(dir, { immutable: true, maxAge: '365d', index: false, dotfiles: 'deny' });
  router.use(POSE_MODEL_BASE, (req, res, next) => (SERVED.test(req.path) ? files(req, res, next) : next()));
  router.use(POSE_MODEL_BASE, () => {
    throw notFound('This model file');
  });
  return router;
}
