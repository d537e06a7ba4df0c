// remix-auth-github talks to github.com only (its OAuth client has the
// endpoints built in). This subclass swaps in a client whose endpoints come
// from configuration: the real service in production, the local fake in
// development and tests, or a GitHub Enterprise host.
import { GitHub, OAuth2RequestError, OAuth2Tokens, UnexpectedResponseError } from "arctic";
import { GitHubStrategy } from "remix-auth-github";
import type { Strategy } from "remix-auth/strategy";

type ClientSettings = { clientId: string; clientSecret: string; redirectURI: string; oauthUrl: string };

export class GitHubAtBaseUrl extends GitHub {
  private readonly settings: ClientSettings;

  constructor(settings: ClientSettings) {
    super(settings.clientId, settings.clientSecret, settings.redirectURI);
    this.settings = settings;
  }

  override createAuthorizationURL(state: string, scopes: string[]): URL {
    const standard = super.createAuthorizationURL(state, scopes);
    return new URL(`${standard.pathname}${standard.search}`, this.settings.oauthUrl);
  }

  override async validateAuthorizationCode(code: string): Promise<OAuth2Tokens> {
    const { clientId, clientSecret, redirectURI, oauthUrl } = this.settings;
    const body = new URLSearchParams({ grant_type: "authorization_code", code, redirect_uri: redirectURI });
    const credentials = Buffer.from(`${encodeURIComponent(clientId)}:${encodeURIComponent(clientSecret)}`);
    const response = await fetch(`${oauthUrl}/login/oauth/access_token`, {
      method: "POST",
      headers: {
        "Content-Type": "application/x-www-form-urlencoded",
        Accept: "application/json",
        Authorization: `Basic ${credentials.toString("base64")}`,
      },
      body,
    });
    const data: unknown = await response.json().catch(() => null);
    if (response.status !== 200 || typeof data !== "object" || data === null) throw new UnexpectedResponseError(response.status);
    if ("error" in data && typeof data.error === "string") {
      const description = "error_description" in data && typeof data.error_description === "string" ? data.error_description : null;
      throw new OAuth2RequestError(data.error, description, null, null);
    }
    return new OAuth2Tokens(data);
  }
}

export class ConfigurableGitHubStrategy<User> extends GitHubStrategy<User> {
  constructor(options: GitHubStrategy.ConstructorOptions & { oauthUrl: string }, verify: Strategy.VerifyFunction<User, GitHubStrategy.VerifyOptions>) {
    super(options, verify);
    this.client = new GitHubAtBaseUrl({
      clientId: options.clientId,
      clientSecret: options.clientSecret,
      redirectURI: options.redirectURI.toString(),
      oauthUrl: options.oauthUrl,
    });
  }
}
