import { Router, type RequestHandler } from "express";
import { accessGuard, type Access } from "../policies/access.js";
import { declaredEffect, type RecordEffect } from "./recordEffects.js";

type Method = "get" | "post" | "put" | "patch" | "delete";

/** One route as declared, with who may call it. */
export interface RouteDeclaration {
  method: Method;
  path: string;
  access: Access;
  /** For mutating routes: what the route does to the records (see recordEffects.ts). */
  effect?: RecordEffect;
}

/**
 * A Router whose every route must declare its access. The declarations land in `registry`
 * (the app's route list), which the role-matrix test walks.
 */
export function policyRouter(mountPath: string, registry: RouteDeclaration[]) {
  const router = Router();
  const add =
    (method: Method) =>
    (path: string, access: Access, ...handlers: RequestHandler[]) => {
      registry.push({ method, path: (mountPath + (path === "/" ? "" : path)) || "/", access, effect: declaredEffect(handlers) });
      router[method](path, accessGuard(access), ...handlers);
    };
  return { mountPath, router, get: add("get"), post: add("post"), put: add("put"), patch: add("patch"), delete: add("delete") };
}

export type PolicyRouter = ReturnType<typeof policyRouter>;
