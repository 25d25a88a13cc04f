/// <reference types="expo/types" />
// Kept here because `expo start` deletes expo-env.d.ts and rewrites tsconfig's include.
