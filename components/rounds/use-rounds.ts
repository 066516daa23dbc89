// The peer-review hooks live with the others in lib/swr (one hook per resource); this path stays
// for code written against it.
export * from '@/lib/swr/use-rounds';
