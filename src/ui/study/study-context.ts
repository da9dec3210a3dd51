import { createContext, useContext } from 'react';
import { useStore } from 'zustand';
import type { StudyState, StudyStore } from '../../store/study-store';

export const StudyContext = createContext<StudyStore | null>(null);

export function useStudyStore(): StudyStore {
  const study = useContext(StudyContext);
  if (!study) throw new Error('The study panel must be inside <StudyContext.Provider>');
  return study;
}

export function useStudy<T>(selector: (s: StudyState) => T): T {
  return useStore(useStudyStore().store, selector);
}
