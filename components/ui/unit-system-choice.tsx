import type { UseFormRegisterReturn } from "react-hook-form";

/** The metric/imperial choice, shared by sign-up and the profile. */
export function UnitSystemChoice({ field, className = "" }: { field: UseFormRegisterReturn; className?: string }) {
  return (
    <fieldset className={`flex flex-col gap-2 ${className}`}>
      <legend className="font-medium">Measure in</legend>
      <label className="flex items-center gap-2">
        <input type="radio" value="metric" {...field} className="h-5 w-5" /> metres, litres and kilograms
      </label>
      <label className="flex items-center gap-2">
        <input type="radio" value="imperial" {...field} className="h-5 w-5" /> feet, gallons and pounds
      </label>
    </fieldset>
  );
}
