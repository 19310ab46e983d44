// The workers load HiGHS before they plan anything; tests load it too, so a route planned here
// comes out exactly as the server plans it (same method, same bound).
import { loadHighs } from "@/lib/routing/lp/highs";

await loadHighs();
