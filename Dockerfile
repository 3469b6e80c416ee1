# An example image for a container platform (not built or tested here; no Docker is needed to
# build or test Eonscale). One image serves every app server; migrations run once per deploy as
# their own step (see README, "Deploying"):
#   docker build -t eonscale .
#   docker run --rm --env-file eonscale.env eonscale npx tsx db/cli.ts migrate
#   docker run --rm --env-file eonscale.env eonscale npx tsx db/cli.ts seed
#   docker run -d --env-file eonscale.env -p 3000:3000 eonscale        (as many as you need)
FROM node:20-bookworm-slim

WORKDIR /app

# Dependencies first (cached while package*.json do not change); the build needs the dev ones.
COPY package.json package-lock.json ./
RUN npm ci

COPY . .
RUN npm run build && npm prune --omit=dev && npm cache clean --force

ENV NODE_ENV=production \
    HOST=0.0.0.0 \
    PORT=3000
EXPOSE 3000
USER node

# Liveness; a load balancer should use GET /readyz (Postgres, S3 and the job queue).
HEALTHCHECK --interval=15s --timeout=5s --start-period=60s \
  CMD node -e "fetch('http://127.0.0.1:'+process.env.PORT+'/healthz').then(r=>process.exit(r.ok?0:1),()=>process.exit(1))"

# Node runs as the main process (not under npm), so SIGTERM reaches the server and it stops
# gracefully: not ready, requests drained, running jobs handed back to the queue. It refuses to
# start on a database with migrations not yet run.
CMD ["node", "--import", "tsx", "server/index.ts"]
