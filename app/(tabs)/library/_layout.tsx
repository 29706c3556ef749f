import { Slot } from 'expo-router';

/** Keeps the Library tab one route ("library") for the tab bar while it holds the entry pages too. */
export default function LibraryLayout() {
  return <Slot />;
}
