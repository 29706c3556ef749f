import { Slot } from 'expo-router';

/** Keeps the Account tab one route ("account") for the tab bar while it holds the group pages too. */
export default function AccountLayout() {
  return <Slot />;
}
