import 'server-only';
// The families' shop data for pages, read through the app's one database instance.
import { db } from '@/db';
import type { ProcessFamilyId } from '@/db/types';
import { loadAllFamilyData, loadFamilyData } from './shop-data';

export const getFamilyData = (family: ProcessFamilyId) => loadFamilyData(db, family);
export const getAllFamilyData = () => loadAllFamilyData(db);
