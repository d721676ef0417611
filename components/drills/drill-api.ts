'use client';
// SWR hooks for the drill library and the assignments (GET /api/drills, GET /api/drill-assignments).
import useSWR from 'swr';
import { fetchJson } from '@/lib/fetcher';
import { assignmentsResponseSchema, drillsResponseSchema } from '@/lib/contracts/drills';

export const DRILLS_URL = '/api/drills';
export const ASSIGNMENTS_URL = '/api/drill-assignments';
const fetchDrills = fetchJson(drillsResponseSchema);
const fetchAssignments = fetchJson(assignmentsResponseSchema);

export const useDrills = () => useSWR(DRILLS_URL, fetchDrills, { revalidateOnFocus: false });
export const useAssignments = () => useSWR(ASSIGNMENTS_URL, fetchAssignments, { revalidateOnFocus: false });
