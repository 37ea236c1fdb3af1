import { CalculatorScreen } from '@/src/screens/checks/calculator/CalculatorScreen';

export default function CalculatorRoute() {
  return <CalculatorScreen />;
}
