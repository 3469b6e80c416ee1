import { describe, expect, it } from "vitest";
import { ACCEPT_ATTRIBUTE, IMAGE_FILES_HINT } from "../../app/lib/images";

describe("the image chooser's words and accept list", () => {
  it("name the accepted formats and the size limit (the words the composer showed before they were derived)", () => {
    expect(IMAGE_FILES_HINT).toBe("JPEG, PNG, WebP, AVIF or TIFF, up to 60 MB");
    expect(ACCEPT_ATTRIBUTE).toBe("image/jpeg,image/png,image/webp,image/avif,image/tiff");
  });
});
