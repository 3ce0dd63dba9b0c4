// Type declaration for mjml 5, which ships without types (its mjml2html is async since v5).
declare module "mjml" {
  export interface MjmlError {
    line: number;
    message: string;
    tagName: string;
    formattedMessage: string;
  }

  export interface MjmlOptions {
    validationLevel?: "strict" | "soft" | "skip";
    keepComments?: boolean;
    beautify?: boolean;
    minify?: boolean;
    fonts?: Record<string, string>;
    filePath?: string;
    ignoreIncludes?: boolean;
  }

  export interface MjmlResult {
    html: string;
    errors: MjmlError[];
  }

  export default function mjml2html(input: string, options?: MjmlOptions): Promise<MjmlResult>;
}
