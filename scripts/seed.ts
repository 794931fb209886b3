import { prepareData } from "./lib/prepare";

prepareData().catch((err) => {
  console.error(err);
  process.exit(1);
});
