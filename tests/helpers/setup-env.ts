// Tests never log requests and never reach a real mail server.
process.env.LOG_LEVEL = 'silent'
