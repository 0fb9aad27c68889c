import { z } from 'zod';

/** Roles per production, weakest first. */
export const ROLES = ['viewer', 'contributor', 'editor', 'owner'] as const;
export type Role = (typeof ROLES)[number];
export const roleSchema = z.enum(ROLES);

export const DEPARTMENTS = ['camera', 'lighting', 'makeup', 'costume', 'art', 'production', 'lab'] as const;
export type Department = (typeof DEPARTMENTS)[number];
export const departmentSchema = z.enum(DEPARTMENTS);

